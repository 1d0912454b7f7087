import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink, RouterLinkActive } from '@angular/router';
import { catchError, EMPTY, map, of, switchMap } from 'rxjs';

import { Session } from '../auth/session';
import { WorkersApi } from './workers-api';

/**
 * A line above every page for the admins while the analysis workers need them (one keeps dying,
 * none takes jobs while runs wait), linking to the workers page. Nothing for anyone else.
 */
@Component({
  selector: 'bk-workers-alert',
  imports: [MatIconModule, RouterLink, RouterLinkActive],
  template: `
    @if (attention(); as attention) {
      <!-- Not on the workers page itself, which says it in its own words. -->
      <p class="bk-workers-alert" role="alert" data-testid="workers-alert" routerLinkActive="bk-on-workers-page">
        <mat-icon aria-hidden="true">warning</mat-icon>
        <span>{{ attention }} <a routerLink="/workers">See the workers</a></span>
      </p>
    }
  `,
  styles: `
    .bk-workers-alert {
      display: flex;
      align-items: flex-start;
      gap: 8px;
      margin: 0 0 16px;
      padding: 10px 16px;
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    .bk-on-workers-page {
      display: none;
    }
    mat-icon {
      flex: none;
    }
    a {
      color: inherit;
      font-weight: 500;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkersAlert {
  private readonly workersApi = inject(WorkersApi);
  private readonly session = inject(Session);
  private readonly isAdmin = computed(() => this.session.roles().includes('admin'));

  protected readonly attention = toSignal(
    toObservable(this.isAdmin).pipe(
      // A failed look is no alert: the page itself says when the API cannot be reached.
      switchMap((admin) => (admin ? this.workersApi.watch().pipe(catchError(() => EMPTY)) : of(null))),
      map((overview) => overview?.attention ?? null),
    ),
    { initialValue: null },
  );
}

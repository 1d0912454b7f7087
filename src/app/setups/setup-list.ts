import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter, switchMap } from 'rxjs';

import type { SetupDto } from '@shared/api';
import { loaded } from '../api/loaded';
import { Session } from '../auth/session';
import { SetupDialog, type SetupDialogData } from './setup-dialog';
import { SetupFacts } from './setup-facts';
import { SetupTrendChart } from './setup-trend-chart';
import { SetupsApi } from './setups-api';

/** The setups, each with its shift leads and the trend of its nightly runs; admins edit them. */
@Component({
  selector: 'bk-setup-list',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, SetupFacts, SetupTrendChart],
  templateUrl: './setup-list.html',
  styleUrl: './setup-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupList {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly reload = signal(0);

  protected readonly isAdmin = inject(Session).hasAnyRole(['admin']);
  protected readonly setups = toSignal(toObservable(this.reload).pipe(switchMap(() => loaded(this.setupsApi.list()))), {
    initialValue: { status: 'loading' },
  });
  protected readonly list = computed(() => {
    const setups = this.setups();
    return setups.status === 'ready' ? setups.value : [];
  });

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  protected openEditor(setup: SetupDto | null): void {
    this.dialog
      .open<SetupDialog, SetupDialogData, SetupDto>(SetupDialog, { data: { setup }, width: '680px', maxWidth: '96vw' })
      .afterClosed()
      .pipe(filter((saved) => saved !== undefined))
      .subscribe((saved) => {
        this.retry();
        this.snackBar.open(`${saved.name} saved.`, undefined, { duration: 4000 });
      });
  }
}

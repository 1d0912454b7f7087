import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { switchMap } from 'rxjs';

import { loaded } from '../api/loaded';
import { CopyButton } from '../clipboard/copy-button';
import { AuditApi } from './audit-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** The public keys results are signed with, each to copy for checking a report away from Bellkeep. */
@Component({
  selector: 'bk-signing-keys',
  imports: [CopyButton, ShownDatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './signing-keys.html',
  styleUrl: './signing-keys.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SigningKeys {
  private readonly auditApi = inject(AuditApi);

  private readonly reload = signal(0);
  protected readonly keys = toSignal(toObservable(this.reload).pipe(switchMap(() => loaded(this.auditApi.signingKeys()))), {
    initialValue: { status: 'loading' },
  });
  protected readonly failure = computed(() => {
    const keys = this.keys();
    return keys.status === 'failed' ? keys.message : '';
  });
  protected readonly list = computed(() => {
    const keys = this.keys();
    return keys.status === 'ready' ? keys.value : null;
  });

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }
}

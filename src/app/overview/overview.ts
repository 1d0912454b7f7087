import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';

import { ROLE_LABELS } from '@shared/api';
import { Session } from '../auth/session';
import { NightLedger } from '../ledger/night-ledger';
import { Worklists } from '../ledger/worklists';
import { ROLE_DUTIES } from './role-duties';

/** The first page after signing in: what waits for you, the ledger of every setup's nights, and what your roles let you do. */
@Component({
  selector: 'bk-overview',
  imports: [NightLedger, Worklists],
  templateUrl: './overview.html',
  styleUrl: './overview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Overview {
  private readonly session = inject(Session);

  protected readonly user = this.session.user;
  protected readonly duties = computed(() => this.session.roles().map((role) => ({ role, label: ROLE_LABELS[role], duty: ROLE_DUTIES[role] })));
}

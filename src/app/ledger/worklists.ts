import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';

import type { WorklistKind } from '@shared/api';
import { failureMessage, loaded, readyValue } from '../api/loaded';
import { VerdictChip } from '../runs/verdict-chip';
import { LedgerApi } from './ledger-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** Each worklist's title, its words when empty, and where its whole list is. */
const LIST_WORDS: Record<WorklistKind, { title: string; empty: string; all: { link: string; query: Record<string, string> } | null }> = {
  'sign-off': { title: 'Waiting for your sign-off', empty: 'No run waits for your sign-off.', all: { link: '/runs', query: { awaitingSignOff: 'true' } } },
  uploads: { title: 'Your uploads without a verdict yet', empty: 'None of your uploads is being analysed or ended without a verdict.', all: null },
  reverifications: { title: 'Re-verifications you asked for', empty: 'You have asked for no re-verification lately.', all: { link: '/audit', query: {} } },
};

/** The signed-in person's worklists, one per role that has one, each with its count and first entries. */
@Component({
  selector: 'bk-worklists',
  imports: [MatIconModule, MatProgressBarModule, RouterLink, ShownDatePipe, VerdictChip],
  templateUrl: './worklists.html',
  styleUrl: './worklists.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Worklists {
  protected readonly state = toSignal(loaded(inject(LedgerApi).worklist()), { initialValue: { status: 'loading' } });
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly lists = computed(() => (readyValue(this.state())?.lists ?? []).map((list) => ({ ...list, words: LIST_WORDS[list.kind] })));
}

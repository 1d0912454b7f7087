import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PlanPoint } from '@shared/api';
import { type AnalysisProfile, QUANTUM_WIN_FRACTION } from '@shared/analysis';
import { formatCount, formatFixed, formatPercent } from '@shared/format/numbers';
import { passLook, type PassLook } from './pass-look';

/** One row of the table: a criterion, what it compares, and its pass probability. */
interface PassRow {
  readonly id: string;
  readonly name: string;
  readonly detail: string;
  readonly look: PassLook;
}

/** The probability that each acceptance criterion passes at the chosen N, and that all do. */
@Component({
  selector: 'bk-plan-pass-table',
  imports: [MatIconModule],
  template: `
    <table class="bk-pass-table" aria-label="Pass probability per criterion">
      <thead>
        <tr>
          <th scope="col">Criterion</th>
          <th scope="col">Expected at this N</th>
          <th scope="col" class="bk-pass-value">Pass probability</th>
        </tr>
      </thead>
      <tbody>
        @for (row of rows(); track row.id) {
          <tr [class.bk-pass-all]="row.id === 'all'">
            <th scope="row">{{ row.name }}</th>
            <td class="bk-muted">{{ row.detail }}</td>
            <td class="bk-pass-value" [attr.data-testid]="'plan-pass-' + row.id">
              <span class="bk-pass-look" [class]="'bk-tone-' + row.look.tone">
                <mat-icon aria-hidden="true">{{ row.look.icon }}</mat-icon>{{ row.look.percent }} · {{ row.look.word }}
              </span>
            </td>
          </tr>
        }
      </tbody>
    </table>
  `,
  styles: `
    .bk-pass-table { width: 100%; border-collapse: collapse; }
    th, td { padding: 6px 8px; border-bottom: 1px solid var(--mat-sys-outline-variant); text-align: left; vertical-align: top; }
    thead th { font: var(--mat-sys-label-large); color: var(--mat-sys-on-surface-variant); }
    tbody th { font: var(--mat-sys-label-large); font-weight: 500; }
    .bk-pass-value { text-align: right; white-space: nowrap; }
    .bk-pass-look { display: inline-flex; align-items: center; gap: 4px; }
    .bk-pass-look mat-icon { width: 18px; height: 18px; font-size: 18px; }
    .bk-pass-all th, .bk-pass-all td { font-weight: 600; border-bottom: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanPassTable {
  /** The expected run at the chosen N. */
  readonly point = input.required<PlanPoint>();
  /** The profile version's parameters, parsed. */
  readonly profile = input.required<AnalysisProfile>();
  /** The expected device. */
  readonly winFraction = input.required<number>();
  readonly qber = input.required<number>();

  protected readonly rows = computed<PassRow[]>(() => {
    const { passProbability, chshTestRounds, keyTestRounds, expectedFiniteKeyBits } = this.point();
    const profile = this.profile();
    const judged = profile.criterion === 'certified' ? 'its confidence bound' : 'the observed value';
    const rows: PassRow[] = [
      {
        id: 'chsh',
        name: 'CHSH win fraction',
        detail: `${formatFixed(this.winFraction())} over ${formatCount(chshTestRounds)} CHSH test rounds; ${judged} must reach ${formatFixed(QUANTUM_WIN_FRACTION - profile.chshTolerance)}`,
        look: passLook(passProbability.chsh),
      },
      {
        id: 'qber',
        name: 'QBER on the key setting',
        detail: `${formatPercent(this.qber())} over ${formatCount(keyTestRounds)} key-setting test rounds; ${judged} must stay at most ${formatPercent(profile.qberTolerance)}`,
        look: passLook(passProbability.qber),
      },
      {
        id: 'minimum-test-rounds',
        name: 'Minimum test rounds',
        detail:
          `${formatCount(Math.min(chshTestRounds, keyTestRounds))} of the rarer kind; at least ${formatCount(profile.minTestRounds)} needed` +
          (profile.blockingChecks.includes('minimum-test-rounds') ? '' : ' (this profile only warns)'),
        look: passLook(passProbability.minimumTestRounds),
      },
    ];
    if (profile.requirePositiveKey) {
      rows.push({
        id: 'positive-key',
        name: 'Positive finite key',
        detail: `${formatCount(expectedFiniteKeyBits)} bits expected; above 0 needed`,
        look: passLook(passProbability.positiveKey),
      });
    }
    rows.push({ id: 'all', name: 'All criteria', detail: 'The product: CHSH and QBER are judged on disjoint rounds', look: passLook(passProbability.all) });
    return rows;
  });
}

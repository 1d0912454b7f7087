import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import { lightTime, marginText } from '@shared/analysis';
import type { SetupDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { EmailAddress } from '../users/email-address';

/** A setup's stations (with their distance and clocks), default profile, shift leads and further mail recipients, as a list of terms. */
@Component({
  selector: 'bk-setup-facts',
  imports: [EmailAddress],
  templateUrl: './setup-facts.html',
  styleUrl: './setup-facts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupFacts {
  /** The setup. */
  readonly setup = input.required<SetupDto>();

  /** "1 200 m: light takes 4 002.769 ns": d/c in vacuum, as the timing check of two station logs takes it (to the picosecond, rounded down). */
  protected distanceWords(metres: number): string {
    return `${formatCount(metres)} m: light takes ${marginText(Number(lightTime(metres).whole))}`;
  }
}

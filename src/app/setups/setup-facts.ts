import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { SetupDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { EmailAddress } from '../users/email-address';

/** Metres light covers in a nanosecond in vacuum: c = 299 792 458 m/s exactly (the SI definition of the metre). */
const METRES_PER_NS = 0.299792458;

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

  /** "1 200 m: light takes 4 003 ns". */
  protected distanceWords(metres: number): string {
    return `${formatCount(metres)} m: light takes ${formatCount(Math.round(metres / METRES_PER_NS))} ns`;
  }
}

import { ChangeDetectionStrategy, Component, input } from '@angular/core';

import type { SetupDto } from '@shared/api';

/** A setup's stations, default profile, shift leads and further mail recipients, as a list of terms. */
@Component({
  selector: 'bk-setup-facts',
  templateUrl: './setup-facts.html',
  styleUrl: './setup-facts.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupFacts {
  /** The setup. */
  readonly setup = input.required<SetupDto>();
}

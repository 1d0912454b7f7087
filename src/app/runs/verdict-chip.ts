import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { RunState } from '@shared/api';
import { lookOfState } from './verdict-look';

/** A run's state as a chip: icon, word and tone. */
@Component({
  selector: 'bk-verdict-chip',
  imports: [MatIconModule],
  template: `<span class="bk-verdict" [class]="'bk-tone-' + look().tone" data-testid="verdict-chip">
    <mat-icon aria-hidden="true">{{ look().icon }}</mat-icon>{{ look().word }}
  </span>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerdictChip {
  /** The run's state. */
  readonly state = input.required<RunState>();

  protected readonly look = computed(() => lookOfState(this.state()));
}

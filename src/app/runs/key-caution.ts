import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { SecuritySummary } from '@shared/analysis';

/** The one line for each attack model. */
const LINES: Record<SecuritySummary['model'], string> = {
  collective: 'Estimate against collective (i.i.d.) attacks.',
  general: 'Estimate against general attacks (entropy accumulation).',
};

/** The one-line caution beside every key figure, naming its attack model, with its fuller explanation on request. */
@Component({
  selector: 'bk-key-caution',
  imports: [MatIconModule],
  template: `
    <span class="bk-caution">
      <mat-icon aria-hidden="true">info</mat-icon>
      {{ line() }} <button type="button" class="bk-caution-more" [attr.aria-expanded]="open()" (click)="open.set(!open())">
        {{ open() ? 'Less' : 'What this means' }}
      </button>
    </span>
    @if (open()) {
      <span class="bk-caution-text">
        @if (model() === 'general') {
          The figure holds against any attack the entropy accumulation theorem covers, given its
          assumptions about the devices and the labs (no information leaves them, settings are chosen
          independently of the devices).
        } @else {
          The key figures assume the devices behave the same, independently, in every round; attacks
          that exploit memory between rounds need the entropy accumulation bound.
        }
        It is an estimate, not a security certificate: final security claims rest on the lab's own
        security proof, the applicable certification and local rules.
      </span>
    }
  `,
  styles: `
    :host { display: block; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .bk-caution { display: block; }
    mat-icon { width: 16px; height: 16px; margin-right: 4px; font-size: 16px; vertical-align: -3px; color: var(--bk-threshold); }
    .bk-caution-more { border: 0; padding: 0; background: none; color: var(--mat-sys-primary); font: inherit; text-decoration: underline; cursor: pointer; }
    .bk-caution-text { display: block; margin-top: 4px; max-width: 70ch; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyCaution {
  /** The attack model the key figure is computed under. */
  readonly model = input<SecuritySummary['model']>('collective');

  protected readonly line = computed(() => LINES[this.model()]);

  /** Whether the fuller explanation is shown. */
  protected readonly open = signal(false);
}

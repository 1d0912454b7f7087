import { ChangeDetectionStrategy, Component, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The one-line caution beside every key figure, with its fuller explanation on request. */
@Component({
  selector: 'bk-key-caution',
  imports: [MatIconModule],
  template: `
    <span class="bk-caution">
      <mat-icon aria-hidden="true">info</mat-icon>
      Estimate against collective (i.i.d.) attacks.
      <button type="button" class="bk-caution-more" [attr.aria-expanded]="open()" (click)="open.set(!open())">
        {{ open() ? 'Less' : 'What this means' }}
      </button>
    </span>
    @if (open()) {
      <span class="bk-caution-text">
        The key figures assume the devices behave the same, independently, in every round. They are
        estimates, not a security certificate: attacks that exploit memory between rounds need the
        entropy accumulation bound, and final security claims rest on the lab's own security proof and
        the applicable certification.
      </span>
    }
  `,
  styles: `
    :host { display: block; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    .bk-caution { display: inline-flex; align-items: center; gap: 4px; flex-wrap: wrap; }
    mat-icon { width: 16px; height: 16px; font-size: 16px; color: var(--bk-threshold); }
    .bk-caution-more { border: 0; padding: 0; background: none; color: var(--mat-sys-primary); font: inherit; text-decoration: underline; cursor: pointer; }
    .bk-caution-text { display: block; margin-top: 4px; max-width: 70ch; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class KeyCaution {
  /** Whether the fuller explanation is shown. */
  protected readonly open = signal(false);
}

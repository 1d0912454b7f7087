import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/**
 * An e-mail address that a narrow column may break only where a reader expects it: after the @
 * and before each dot (`<wbr>`), never in the middle of a name, nor at a hyphen ("night-desk"):
 * each part is kept whole by CSS, so a copied address stays the address, with its own hyphens.
 */
@Component({
  selector: 'bk-email-address',
  template: `@for (part of parts(); track $index) {@if (!$first) {<wbr />}<span class="bk-email-part">{{ part }}</span>}`,
  styles: '.bk-email-part { white-space: nowrap; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmailAddress {
  /** The address. */
  readonly address = input.required<string>();

  protected readonly parts = computed(() => this.address().split(/(?<=@)|(?=\.)/));
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/**
 * An e-mail address that a narrow column may break only where a reader expects it: after the @
 * and before each dot (`<wbr>`), never in the middle of a name.
 */
@Component({
  selector: 'bk-email-address',
  template: `@for (part of parts(); track $index) {@if (!$first) {<wbr />}{{ part }}}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EmailAddress {
  /** The address. */
  readonly address = input.required<string>();

  protected readonly parts = computed(() => this.address().split(/(?<=@)|(?=\.)/));
}

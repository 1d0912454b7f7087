import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { CopyButton } from '../clipboard/copy-button';

/** Hex digits shown of a hash: enough to tell runs apart at a glance and to search by. */
const SHOWN_DIGITS = 12;

/** A SHA-256 or fingerprint shortened in the mono font; the full value is in its title, and with `copyAs` a button copies it. */
@Component({
  selector: 'bk-short-hash',
  imports: [CopyButton],
  template: `@if (value(); as value) {
      <code class="bk-short-hash" [title]="value">{{ shortened() }}</code>
      @if (copyAs(); as what) {
        <bk-copy-button [text]="value" [what]="what" />
      }
    } @else {
      –
    }`,
  styles: `
    :host {
      white-space: nowrap;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShortHash {
  /** The hash in hex, or null when there is none yet. */
  readonly value = input.required<string | null>();
  /** Names the hash for a copy button beside it ("the seed commitment"); null: no button. */
  readonly copyAs = input<string | null>(null);

  protected readonly shortened = computed(() => {
    const value = this.value() ?? '';
    return value.length > SHOWN_DIGITS ? `${value.slice(0, SHOWN_DIGITS)}…` : value;
  });
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import { EmailAddress } from './email-address';

/** An e-mail address inside running text: no spaces, an @ and a domain, not ending in a sentence's full stop. */
const ADDRESS = /[^\s,;:()<>@]+@[^\s,;:()<>@]*[^\s,;:()<>@.]/g;

/** A piece of a text: plain words, or an e-mail address. */
export interface TextPart {
  readonly text: string;
  readonly address: boolean;
}

/** Cuts a text into its plain pieces and the e-mail addresses in it, in order. */
export function textParts(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let from = 0;
  for (const match of text.matchAll(ADDRESS)) {
    if (match.index > from) parts.push({ text: text.slice(from, match.index), address: false });
    parts.push({ text: match[0], address: true });
    from = match.index + match[0].length;
  }
  if (from < text.length) parts.push({ text: text.slice(from), address: false });
  return parts;
}

/**
 * A sentence of the trail that may name people by address ("To lucia.brandt@…, night-desk@…"):
 * each address shown as `bk-email-address`, which breaks a narrow line only after its @ and before
 * its dots.
 */
@Component({
  selector: 'bk-text-with-addresses',
  imports: [EmailAddress],
  template: `@for (part of parts(); track $index) {@if (part.address) {<bk-email-address [address]="part.text" />} @else {{{ part.text }}}}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TextWithAddresses {
  /** The text. */
  readonly text = input.required<string>();

  protected readonly parts = computed(() => textParts(this.text()));
}

/**
 * One block of a mail. A mail is written once as blocks and rendered twice, as its text part and
 * its HTML part, so the two always say the same.
 */
export type MailBlock =
  /** The first lines: a bold headline and the sentence under it. */
  | { kind: 'lead'; headline: string; detail: string }
  /** A heading over a list; `notes`, if any, follow the list in italics. */
  | { kind: 'list'; heading: string; items: readonly string[]; notes?: readonly string[] }
  | { kind: 'paragraph'; text: string }
  /** A link: in the text part `text` then the address, in the HTML part `label` as the anchor. */
  | { kind: 'link'; text: string; label: string; url: string };

/** The text part: blocks apart by a blank line, list items indented after a dash. */
export function mailText(blocks: readonly MailBlock[]): string {
  return blocks
    .map((block) => {
      switch (block.kind) {
        case 'lead':
          return `${block.headline}\n${block.detail}`;
        case 'list':
          return [block.heading, ...block.items.map((item) => `  - ${item}`), ...(block.notes?.length ? ['', ...block.notes] : [])].join('\n');
        case 'paragraph':
          return block.text;
        case 'link':
          return `${block.text}: ${block.url}`;
      }
    })
    .join('\n\n');
}

/** The HTML part: every text escaped, one element per line. */
export function mailHtml(blocks: readonly MailBlock[]): string {
  return blocks
    .map((block) => {
      switch (block.kind) {
        case 'lead':
          return `<p><strong>${escapeHtml(block.headline)}</strong></p>\n<p>${escapeHtml(block.detail)}</p>`;
        case 'list':
          return (
            `<p>${escapeHtml(block.heading)}</p><ul>${block.items.map((item) => `<li>${escapeHtml(item)}</li>`).join('')}</ul>` +
            (block.notes ?? []).map((note) => `<p><em>${escapeHtml(note)}</em></p>`).join('')
          );
        case 'paragraph':
          return `<p>${escapeHtml(block.text)}</p>`;
        case 'link':
          return `<p><a href="${escapeHtml(block.url)}">${escapeHtml(block.label)}</a></p>`;
      }
    })
    .join('\n');
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (character) => `&#${character.charCodeAt(0)};`);
}

/** A piece of a sentence: plain words, or the words "run N" to link to run N. */
export type SentencePart = { text: string; runId?: undefined } | { text: string; runId: number };

/**
 * A sentence cut around every "run N" in it, so a page can link each run while the words stay
 * exactly those of the mail and the PDF.
 *
 * @example runLinkParts('Other attempts: 1 — run 12, ABORT.') // ['Other attempts: 1 — ', run 12 → 12, ', ABORT.']
 */
export function runLinkParts(sentence: string): SentencePart[] {
  const parts: SentencePart[] = [];
  let from = 0;
  for (const match of sentence.matchAll(/\brun (\d+)\b/g)) {
    if (match.index > from) parts.push({ text: sentence.slice(from, match.index) });
    parts.push({ text: match[0], runId: Number(match[1]) });
    from = match.index + match[0].length;
  }
  if (from < sentence.length) parts.push({ text: sentence.slice(from) });
  return parts;
}

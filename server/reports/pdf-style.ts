// The report's look: an A4 page, its margins, type sizes and its tones.

/** A4 in points, with margins; the footer sits in the bottom margin. */
export const PAGE = { size: 'A4', margin: 48, bottomMargin: 60 } as const;

/** Type sizes in points. */
export const TYPE = { title: 17, verdict: 24, heading: 10.5, body: 8.5, small: 7.5, mono: 7 } as const;

/** Colours: the verdict tones, the threshold amber and the fibre teal are the app's `--bk-*` values (src/styles.scss); the greys are the report's own. */
export const TONE = {
  text: '#1b1f22',
  muted: '#5f6b73',
  rule: '#c4cbd0',
  fill: '#eef2f3',
  primary: '#04696c',
  accept: '#1d7a3e',
  abort: '#c9411c',
  invalid: '#4f5d6e',
  threshold: '#8a5a00',
} as const;

/** Decimals of the CHSH win fraction and its bounds: those of the verdict's own reasons. */
export const WIN_DECIMALS = 6;

/** Decimals of QBER percentages (0.022705 → 2.271 %). */
export const PERCENT_DECIMALS = 3;

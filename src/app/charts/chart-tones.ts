/** The colours charts share with the stylesheet: verdict tones, the threshold amber and the theme's primary. */
export type ChartTone = 'accept' | 'abort' | 'invalid' | 'pending' | 'threshold' | 'primary' | 'general';

const PROPERTY: Record<ChartTone, string> = {
  accept: '--bk-accept',
  abort: '--bk-abort',
  invalid: '--bk-invalid',
  pending: '--bk-pending',
  threshold: '--bk-threshold',
  primary: '--bk-series',
  general: '--bk-series-general',
};

/** The colour of `tone`, read from the page's custom properties so a tone has one value everywhere. */
export function chartTone(tone: ChartTone): string {
  return getComputedStyle(document.documentElement).getPropertyValue(PROPERTY[tone]).trim() || 'gray';
}

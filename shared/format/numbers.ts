/** Thin space, the thousands separator of Bellkeep's figures (DESIGN: counts with thin spaces). */
const THIN_SPACE = '\u2009';

/** A whole count with thin-space thousands separators: 1 500 000 → "1 500 000". */
export function formatCount(value: number): string {
  const sign = value < 0 ? '−' : '';
  return (
    sign +
    Math.round(Math.abs(value))
      .toString()
      .replace(/\B(?=(\d{3})+(?!\d))/g, THIN_SPACE)
  );
}

/** A figure with a fixed number of decimals, or an en dash when there is none. */
export function formatFixed(value: number | null | undefined, decimals = 4): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '–' : value.toFixed(decimals);
}

/** ε's and p-values in scientific notation: 1e-9 → "1e-9", 0.00123 → "1.2e-3". */
export function formatScientific(value: number | null | undefined, digits = 2): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '–';
  if (value === 0) return '0';
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
  const trimmed = mantissa.replace(/\.?0+$/, '');
  return `${trimmed}e${Number(exponent)}`;
}

/** A p-value from its log10, for values far below what a double holds: −1234.5 → "3.2e-1235". */
export function formatLog10(log10: number): string {
  if (!Number.isFinite(log10)) return '–';
  if (log10 > -300) return formatScientific(10 ** log10);
  const exponent = Math.floor(log10);
  return `${(10 ** (log10 - exponent)).toFixed(1)}e${exponent}`;
}

/** A p-value from its log10: three significant digits down to 1e-4 ("0.0884", "1.00"), then as `formatLog10`; never 0. */
export function formatPValue(log10PValue: number): string {
  const p = 10 ** log10PValue;
  return p >= 1e-4 ? p.toPrecision(3) : formatLog10(log10PValue);
}

/** A rate as a percentage with two decimals: 0.0182 → "1.82 %". */
export function formatPercent(value: number | null | undefined, decimals = 2): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '–' : `${(value * 100).toFixed(decimals)}${THIN_SPACE}%`;
}

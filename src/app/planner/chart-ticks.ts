import { formatPercent, formatScientific } from '@shared/format/numbers';

/** Tick words of a logarithmic axis: the powers of ten in scientific notation ("1e6"), the ticks between them unlabelled. */
export function powerOfTenTick(value: number | string): string {
  const exponent = Math.log10(Number(value));
  return Math.abs(exponent - Math.round(exponent)) < 1e-9 ? formatScientific(Number(value), 1) : '';
}

/** Tick words of a probability or fraction axis: whole percentages. */
export function percentTick(value: number | string): string {
  return formatPercent(Number(value), 0);
}

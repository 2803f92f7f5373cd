/** Number formatting for people: fixed significant digits, thin grouping, no exponent for everyday sizes. */

/** `x` with `sig` significant digits, trailing zeros trimmed ("12.5", "0.00312"). */
export function fmt(x: number | null | undefined, sig = 4): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  if (x === 0) return '0';
  const a = Math.abs(x);
  if (a >= 1e7 || a < 1e-4) return x.toExponential(sig - 1);
  const digits = Math.max(0, sig - 1 - Math.floor(Math.log10(a)));
  return x.toFixed(Math.min(digits, 10)).replace(/(\.\d*?)0+$/, '$1').replace(/\.$/, '');
}

/** A fraction 0..1 as a percentage with 3 decimals ("42.118 %"). */
export function pct(x: number | null | undefined, decimals = 3): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '–';
  return `${(100 * x).toFixed(decimals)} %`;
}

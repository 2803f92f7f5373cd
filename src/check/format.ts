/** Numbers in check messages: four significant digits, no float noise (0.38099999999999995 → 0.381). */
export function formatValue(x: number, significant = 4): string {
  if (x === 0) return '0';
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  return a >= 1e5 || a < 1e-3 ? x.toExponential(significant - 1) : String(Number(x.toPrecision(significant)));
}

/**
 * One number per square cell (i, j) of a hash grid, for Map and Set keys: i·2²² + j. Distinct and exact in a
 * double for |i|, |j| < 2²² (products below 2⁴⁴ ≪ 2⁵³).
 */
export function cellKey(i: number, j: number): number {
  return i * 4_194_304 + j;
}

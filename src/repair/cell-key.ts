/** Hash-grid key of square cell (i, j): i·2²² + j, exact in a double for |i|, |j| < 2²². */
export function cellKey(i: number, j: number): number {
  return i * 4_194_304 + j;
}

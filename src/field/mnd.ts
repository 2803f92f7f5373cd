/**
 * The measure of non-discreteness M_nd of a density field (O. Sigmund, "Morphology-based black and white filters
 * for topology optimization", Struct. Multidisc. Optim. 33(4–5):401–424, 2007, DOI 10.1007/s00158-006-0087-x):
 * M_nd = (1/n) Σ 4ρ(1 − ρ) · 100 %, over n densities ρ in [0, 1]; 0 % for a black-and-white field, 100 % when
 * every ρ is ½. Sum `mndTerm` over the samples, then `mndPercent`.
 */

/** ρ in [0, 1] (clip first). */
export function mndTerm(rho: number): number {
  return rho * (1 - rho);
}

/** M_nd in % from the sum of `mndTerm` over `n` samples; NaN for none. */
export function mndPercent(sum: number, n: number): number {
  return n > 0 ? (400 * sum) / n : NaN;
}

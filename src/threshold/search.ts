/**
 * Find the iso-level whose raw marching-squares region has a given area, without re-contouring.
 *
 * The enclosed area A(L) of the region {value ≥ L} is a sum over lattice cells: a cell whose smallest
 * corner value is ≥ L is full, one whose largest corner value is < L is empty, and only the cells whose
 * corner range straddles L need the piecewise-linear area of the case polygon. A(L) is continuous and
 * non-increasing, so bisection applies; each step keeps only the cells whose range meets the current
 * bracket (the "active" cells), so after the first steps the work is proportional to the boundary length,
 * not to the number of cells.
 */

/** Per-cell view of the lattice the contour is drawn on (provided by the contour stage). */
export interface LevelAreaModel {
  /** Number of lattice cells. */
  readonly cellCount: number;
  /** Smallest and largest corner value of each cell. */
  readonly cellMin: Float64Array;
  readonly cellMax: Float64Array;
  /** Area of the cell in mm² (its area when it is entirely solid). */
  fullArea(cell: number): number;
  /** Area in mm² of the part of the cell at or above `level`. */
  cellArea(cell: number, level: number): number;
}

export interface RawLevelResult {
  /** The level found (value units, 0..1 after prepare). */
  readonly level: number;
  /** Raw region area at that level, mm². */
  readonly area: number;
  /** Bisection steps taken. */
  readonly steps: number;
}

/**
 * Level L such that the raw region area A(L) equals `targetArea` (mm²) to `relTol` (relative to the target)
 * or until the bracket can no longer shrink. Returns the bracket end nearer the target when the target lies
 * outside [A(max), A(min)].
 */
export function levelForArea(model: LevelAreaModel, targetArea: number, relTol = 1e-7): RawLevelResult {
  const n = model.cellCount;
  const { cellMin, cellMax } = model;
  let lo = Infinity;
  let hi = -Infinity;
  for (let c = 0; c < n; c++) {
    if (cellMin[c] < lo) lo = cellMin[c];
    if (cellMax[c] > hi) hi = cellMax[c];
  }
  // Active cells: range meets [lo, hi]. `fullBase`: area of cells with min ≥ hi (full for every L ≤ hi).
  let active = new Int32Array(n);
  for (let c = 0; c < n; c++) active[c] = c;
  let activeCount = n;
  let fullBase = 0;
  const areaAt = (level: number): number => {
    let a = fullBase;
    for (let k = 0; k < activeCount; k++) {
      const c = active[k];
      if (cellMin[c] >= level) a += model.fullArea(c);
      else if (cellMax[c] >= level) a += model.cellArea(c, level);
    }
    return a;
  };
  const aLo = areaAt(lo);
  const aHi = areaAt(hi);
  if (targetArea >= aLo) return { level: lo, area: aLo, steps: 0 };
  if (targetArea <= aHi) return { level: hi, area: aHi, steps: 0 };
  const tol = Math.abs(targetArea) * relTol;
  let steps = 0;
  let best = { level: lo, area: aLo };
  for (; steps < 200; steps++) {
    const mid = 0.5 * (lo + hi);
    if (!(mid > lo && mid < hi)) break;
    const a = areaAt(mid);
    if (Math.abs(a - targetArea) < Math.abs(best.area - targetArea)) best = { level: mid, area: a };
    if (Math.abs(a - targetArea) <= tol) break;
    if (a > targetArea) lo = mid;
    else hi = mid;
    // Narrow the active set to cells whose range meets [lo, hi]; cells entirely ≥ hi become part of the base.
    let m = 0;
    const next = active;
    for (let k = 0; k < activeCount; k++) {
      const c = active[k];
      if (cellMin[c] >= hi) fullBase += model.fullArea(c);
      else if (cellMax[c] >= lo) next[m++] = c;
    }
    activeCount = m;
    active = next;
  }
  return { level: best.level, area: best.area, steps };
}

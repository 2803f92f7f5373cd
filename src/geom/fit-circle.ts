/**
 * Recognising rings that are circles: a least-squares circle fit and a strict acceptance rule.
 *
 * Fit: the algebraic fit of I. Kåsa, "A circle fitting procedure and its error analysis", IEEE Transactions
 * on Instrumentation and Measurement IM-25(1):8–14, 1976, doi:10.1109/TIM.1976.6312298 (minimise
 * Σ (x² + y² + D·x + E·y + F)², linear in D, E, F), refined by Gauss–Newton steps of the geometric fit
 * (minimise Σ (ρᵢ − r)², ρᵢ the distance of vertex i from the centre) as in W. Gander, G. H. Golub and
 * R. Strebel, "Least-squares fitting of circles and ellipses", BIT Numerical Mathematics 34(4):558–578, 1994,
 * doi:10.1007/BF01934268. Coordinates are centred on the vertex mean and scaled by the RMS distance from it
 * before fitting, so rings far from the origin or very small or large fit equally well.
 *
 * Acceptance (ours): the ring has at least 8 vertices; every vertex and every edge midpoint lies within
 * `tolerance` mm of the fitted circle; and the vertices go once around the centre — every step of their angle
 * about the centre turns the same way by at most 45°, and the steps add up to one full turn (±2π).
 */
import { RhoformError } from '../errors.js';
import type { PolygonSet, Ring } from '../types.js';
import type { RingCircle } from './circle.js';
import type { Circle } from './circle.js';

/** Fewest vertices a ring needs to count as a circle. */
export const MIN_CIRCLE_VERTICES = 8;
/** Largest angle (radians) between consecutive vertices as seen from the centre: 45°. */
export const MAX_CIRCLE_GAP = Math.PI / 4;
/** At most this many Gauss–Newton steps after the algebraic fit (each one pass over the vertices). */
const GAUSS_NEWTON_STEPS = 10;
const TWO_PI = 2 * Math.PI;

/**
 * The circle through a ring, or null when the ring is not a circle within `tolerance`.
 *
 * Input: a ring in mm (y up; either orientation; implicitly closed — a repeated closing vertex is ignored);
 * `tolerance` in mm (finite, ≥ 0). Output: centre (cx, cy) and radius r in mm — the least-squares circle
 * through the vertices (Kåsa 1976 algebraic fit, then Gauss–Newton on the geometric distances, Gander, Golub
 * & Strebel 1994; see the file header) — when the ring has ≥ 8 vertices, every vertex and every edge midpoint
 * lies within `tolerance` of it, and the vertices go exactly once around its centre in steps of at most 45°.
 * Null for fewer vertices, non-finite coordinates, collinear or coincident vertices, or a failed test.
 * Pure, O(vertices); throws RhoformError `E_INTERNAL` for a negative or non-finite tolerance.
 */
export function fitCircle(ring: Ring, tolerance: number): Circle | null {
  if (!(tolerance >= 0 && Number.isFinite(tolerance))) {
    throw new RhoformError('E_INTERNAL', `expected a circle tolerance ≥ 0 mm, found ${String(tolerance)}`);
  }
  let n = ring.length;
  if (n >= 2 && ring[0][0] === ring[n - 1][0] && ring[0][1] === ring[n - 1][1]) n--;
  if (n < MIN_CIRCLE_VERTICES) return null;
  const fit = leastSquaresCircle(ring, n);
  if (fit === null) return null;
  return fitsWithin(ring, n, fit, tolerance) && goesOnceAround(ring, n, fit) ? fit : null;
}

/**
 * Every ring of `set` (outer rings and holes) that `fitCircle` accepts at `tolerance` mm, as a RingCircle
 * (polygon index; ring 0 = outer, k ≥ 1 = hole k − 1; centre and radius in mm; layer unset), in polygon and
 * ring order. Pure, O(vertices).
 */
export function findCircleRings(set: PolygonSet, tolerance: number): RingCircle[] {
  const found: RingCircle[] = [];
  set.polygons.forEach((polygon, i) => {
    for (let k = 0; k <= polygon.holes.length; k++) {
      const c = fitCircle(k === 0 ? polygon.outer : polygon.holes[k - 1], tolerance);
      if (c !== null) found.push({ polygon: i, ring: k, x: c.cx, y: c.cy, r: c.r });
    }
  });
  return found;
}

/** Kåsa's algebraic fit refined by Gauss–Newton on the geometric distances; null when degenerate. */
function leastSquaresCircle(ring: Ring, n: number): Circle | null {
  let mx = 0;
  let my = 0;
  for (let i = 0; i < n; i++) {
    mx += ring[i][0];
    my += ring[i][1];
  }
  mx /= n;
  my /= n;
  let s2 = 0;
  for (let i = 0; i < n; i++) s2 += (ring[i][0] - mx) ** 2 + (ring[i][1] - my) ** 2;
  const s = Math.sqrt(s2 / n);
  if (!(s > 0 && Number.isFinite(s) && Number.isFinite(mx) && Number.isFinite(my))) return null;

  // Kåsa: with centred coordinates (Σu = Σv = 0) the normal equations split: F = −mean(z) and a 2×2 system
  // [Suu Suv; Suv Svv]·[D; E] = −[Suz; Svz], z = u² + v²; centre (−D/2, −E/2), r² = (D² + E²)/4 − F.
  let suu = 0;
  let svv = 0;
  let suv = 0;
  let suz = 0;
  let svz = 0;
  let sz = 0;
  for (let i = 0; i < n; i++) {
    const u = (ring[i][0] - mx) / s;
    const v = (ring[i][1] - my) / s;
    const z = u * u + v * v;
    suu += u * u;
    svv += v * v;
    suv += u * v;
    suz += u * z;
    svz += v * z;
    sz += z;
  }
  const det = suu * svv - suv * suv;
  // Suu + Svv = n after scaling; a determinant this small means the vertices lie on a line.
  if (!(det > 1e-12 * n * n)) return null;
  const d = -(suz * svv - svz * suv) / det;
  const e = -(svz * suu - suz * suv) / det;
  let a = -d / 2;
  let b = -e / 2;
  let r = Math.sqrt(a * a + b * b + sz / n);

  // Gauss–Newton on dᵢ = ρᵢ − r: J rows [−(uᵢ − a)/ρᵢ, −(vᵢ − b)/ρᵢ, −1], step δ solves (JᵀJ)·δ = −Jᵀd.
  // A step is kept only when it lowers Σ dᵢ², so the refinement never makes the algebraic fit worse.
  const m = new Float64Array(10);
  const next = new Float64Array(10);
  if (!(normalEquations(ring, n, mx, my, s, a, b, r, m) < Infinity)) return null;
  for (let step = 0; step < GAUSS_NEWTON_STEPS; step++) {
    const delta = solveSymmetric3(m);
    if (delta === null) break;
    const [da, db, dr] = delta;
    const cost = m[0];
    const nextCost = normalEquations(ring, n, mx, my, s, a + da, b + db, r + dr, next);
    if (!(nextCost <= cost) || !(r + dr > 0)) break;
    a += da;
    b += db;
    r += dr;
    m.set(next);
    if (Math.max(Math.abs(da), Math.abs(db), Math.abs(dr)) < 1e-14) break;
  }
  const circle = { cx: mx + a * s, cy: my + b * s, r: r * s };
  return Number.isFinite(circle.cx) && Number.isFinite(circle.cy) && circle.r > 0 && Number.isFinite(circle.r)
    ? circle
    : null;
}

/**
 * Fills `m` with [Σd², (JᵀJ)₁₁, ₁₂, ₁₃, ₂₂, ₂₃, ₃₃, (Jᵀd)₁, ₂, ₃] of the geometric fit at centre (a, b) and
 * radius r in the scaled frame, and returns Σd² (Infinity when a vertex sits on the centre).
 */
function normalEquations(
  ring: Ring,
  n: number,
  mx: number,
  my: number,
  s: number,
  a: number,
  b: number,
  r: number,
  m: Float64Array,
): number {
  m.fill(0);
  for (let i = 0; i < n; i++) {
    const du = (ring[i][0] - mx) / s - a;
    const dv = (ring[i][1] - my) / s - b;
    const rho = Math.sqrt(du * du + dv * dv);
    if (!(rho > 0)) return (m[0] = Infinity);
    const ja = -du / rho;
    const jb = -dv / rho;
    const res = rho - r;
    m[0] += res * res;
    m[1] += ja * ja;
    m[2] += ja * jb;
    m[3] -= ja;
    m[4] += jb * jb;
    m[5] -= jb;
    m[6] += 1;
    m[7] += ja * res;
    m[8] += jb * res;
    m[9] -= res;
  }
  return m[0];
}

/** Solves (JᵀJ)·δ = −Jᵀd from `m` (layout of normalEquations) by Cholesky; null when not positive definite. */
function solveSymmetric3(m: Float64Array): [number, number, number] | null {
  const l11 = Math.sqrt(m[1]);
  if (!(l11 > 0)) return null;
  const l21 = m[2] / l11;
  const l31 = m[3] / l11;
  const q22 = m[4] - l21 * l21;
  if (!(q22 > 1e-14 * m[4])) return null;
  const l22 = Math.sqrt(q22);
  const l32 = (m[5] - l31 * l21) / l22;
  const q33 = m[6] - l31 * l31 - l32 * l32;
  if (!(q33 > 1e-14 * m[6])) return null;
  const l33 = Math.sqrt(q33);
  // Forward then back substitution for L·Lᵀ·δ = −g.
  const y1 = -m[7] / l11;
  const y2 = (-m[8] - l21 * y1) / l22;
  const y3 = (-m[9] - l31 * y1 - l32 * y2) / l33;
  const d3 = y3 / l33;
  const d2 = (y2 - l32 * d3) / l22;
  const d1 = (y1 - l21 * d2 - l31 * d3) / l11;
  return Number.isFinite(d1) && Number.isFinite(d2) && Number.isFinite(d3) ? [d1, d2, d3] : null;
}

/** Every vertex and every edge midpoint within `tolerance` mm of the circle. */
function fitsWithin(ring: Ring, n: number, c: Circle, tolerance: number): boolean {
  for (let i = 0; i < n; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[i + 1 < n ? i + 1 : 0];
    if (!(Math.abs(Math.hypot(x0 - c.cx, y0 - c.cy) - c.r) <= tolerance)) return false;
    const xm = (x0 + x1) / 2;
    const ym = (y0 + y1) / 2;
    if (!(Math.abs(Math.hypot(xm - c.cx, ym - c.cy) - c.r) <= tolerance)) return false;
  }
  return true;
}

/**
 * The vertices go once around the centre: each step of their angle about it (wrapped into (−π, π]) turns the
 * same way by at most MAX_CIRCLE_GAP (zero steps allowed), and the steps sum to ±2π.
 */
function goesOnceAround(ring: Ring, n: number, c: Circle): boolean {
  const gap = MAX_CIRCLE_GAP * (1 + 1e-9);
  let turn = 0;
  let sign = 0;
  let prev = Math.atan2(ring[n - 1][1] - c.cy, ring[n - 1][0] - c.cx);
  for (let i = 0; i < n; i++) {
    const angle = Math.atan2(ring[i][1] - c.cy, ring[i][0] - c.cx);
    let step = angle - prev;
    if (step > Math.PI) step -= TWO_PI;
    else if (step <= -Math.PI) step += TWO_PI;
    prev = angle;
    if (!(Math.abs(step) <= gap)) return false;
    if (step !== 0) {
      const sg = step > 0 ? 1 : -1;
      if (sign !== 0 && sg !== sign) return false;
      sign = sg;
    }
    turn += step;
  }
  return Math.abs(Math.abs(turn) - TWO_PI) < 1e-6;
}

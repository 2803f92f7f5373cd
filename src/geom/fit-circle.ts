/**
 * Rings that are circles: I. Kåsa, "A circle fitting procedure and its error analysis", IEEE Trans. Instrum.
 * Meas. IM-25(1):8–14, 1976, doi:10.1109/TIM.1976.6312298, refined by Gauss–Newton on the geometric distances
 * (W. Gander, G. H. Golub, R. Strebel, "Least-squares fitting of circles and ellipses", BIT 34(4):558–578, 1994,
 * doi:10.1007/BF01934268). Acceptance rule: docs/notes/geom.md. mm, y up.
 */
import { RhoformError } from '../errors.js';
import type { PolygonSet, Ring } from '../types.js';
import type { RingCircle } from './circle.js';
import type { Circle } from './circle.js';
import { hypot } from './portable-math.js';

export const MIN_CIRCLE_VERTICES = 8;
/** Radians. */
export const MAX_CIRCLE_GAP = Math.PI / 4;
const GAUSS_NEWTON_STEPS = 10;
const TWO_PI = 2 * Math.PI;

/** The circle through a ring (mm, either orientation), or null when it is not one within `tolerance` mm; throws E_INTERNAL for a bad tolerance. */
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

/** Every ring `fitCircle` accepts, in polygon and ring order. */
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

  // Kåsa on centred coordinates: F = −mean(z), [Suu Suv; Suv Svv]·[D; E] = −[Suz; Svz], z = u² + v²
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
  // a determinant this small: the vertices lie on a line
  if (!(det > 1e-12 * n * n)) return null;
  const d = -(suz * svv - svz * suv) / det;
  const e = -(svz * suu - suz * suv) / det;
  let a = -d / 2;
  let b = -e / 2;
  let r = Math.sqrt(a * a + b * b + sz / n);

  // Gauss–Newton on dᵢ = ρᵢ − r; a step is kept only when it lowers Σ dᵢ²
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

/** Fills `m` with [Σd², JᵀJ (upper), Jᵀd] at centre (a, b), radius r; returns Σd² (Infinity when a vertex is on the centre). */
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

/** Solves (JᵀJ)·δ = −Jᵀd by Cholesky; null when not positive definite. */
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
  const y1 = -m[7] / l11;
  const y2 = (-m[8] - l21 * y1) / l22;
  const y3 = (-m[9] - l31 * y1 - l32 * y2) / l33;
  const d3 = y3 / l33;
  const d2 = (y2 - l32 * d3) / l22;
  const d1 = (y1 - l21 * d2 - l31 * d3) / l11;
  return Number.isFinite(d1) && Number.isFinite(d2) && Number.isFinite(d3) ? [d1, d2, d3] : null;
}

function fitsWithin(ring: Ring, n: number, c: Circle, tolerance: number): boolean {
  for (let i = 0; i < n; i++) {
    const [x0, y0] = ring[i];
    const [x1, y1] = ring[i + 1 < n ? i + 1 : 0];
    if (!(Math.abs(hypot(x0 - c.cx, y0 - c.cy) - c.r) <= tolerance)) return false;
    const xm = (x0 + x1) / 2;
    const ym = (y0 + y1) / 2;
    if (!(Math.abs(hypot(xm - c.cx, ym - c.cy) - c.r) <= tolerance)) return false;
  }
  return true;
}

/** Angle steps about the centre all one way, each ≤ MAX_CIRCLE_GAP, summing to ±2π. */
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

/**
 * Local thickness of the solid on a coarse raster, for pictures: τ(p) = diameter of the largest disc inside the
 * solid that contains p (T. Hildebrand & P. Rüegsegger, "A new method for the model-independent assessment of
 * thickness in three-dimensional images", J. Microscopy 185(1):67–75, 1997, DOI 10.1046/j.1365-2818.1997.1340694.x).
 * A lower bound raised three times — own distance, medial discs, ridge discs (docs/notes/morph.md, "Thickness").
 * Frame: mm, y up; coarse pixel (i, j) covers [minX + i·s, minX + (i + 1)·s] × [minY + j·s, …] with
 * s = max(W, H)/maxSide; values[j·nx + i], j up; NaN where the coarse centre is void.
 */
import type { ThicknessMap } from './types.js';
import type { MedialSamples } from './medial.js';
import { footTo, type NearestField } from './nearest.js';
import type { SegmentSet } from './segments.js';
import type { Frame } from './frame.js';
import { hypot } from '../geom/portable-math.js';

/** Coarse local-thickness raster of the solid, at most `maxSide` pixels along the longer side. */
export function thicknessMap(
  frame: Frame,
  set: SegmentSet,
  field: NearestField,
  phase: Uint8Array,
  samples: MedialSamples,
  maxSide: number,
): ThicknessMap {
  const [minX, minY, maxX, maxY] = frame.domain;
  const W = maxX - minX, H = maxY - minY;
  const side = Math.max(1, Math.floor(maxSide));
  const s = Math.max(W, H) / side;
  const cnx = Math.max(1, Math.min(side, Math.ceil(W / s - 1e-9)));
  const cny = Math.max(1, Math.min(side, Math.ceil(H / s - 1e-9)));
  const values = new Float32Array(cnx * cny);
  const px = frame.pixel;
  // fine pixel holding a mm point
  const fineOf = (x: number, y: number): number => {
    const i = Math.min(frame.nx - 1, Math.max(0, Math.floor((x - frame.x0) / px)));
    const j = Math.min(frame.ny - 1, Math.max(0, Math.floor((y - frame.y0) / px)));
    return j * frame.nx + i;
  };
  for (let j = 0; j < cny; j++) {
    for (let i = 0; i < cnx; i++) {
      const p = fineOf(minX + (i + 0.5) * s, minY + (j + 0.5) * s);
      values[j * cnx + i] = phase[p] === 1 ? 2 * Math.min(field.dist[p], 1e30) * px : NaN;
    }
  }
  // the largest solid medial disc per coarse pixel
  const pick = new Int32Array(cnx * cny).fill(-1);
  for (let k = 0; k < samples.n; k++) {
    if (samples.solid[k] !== 1) continue;
    const x = frame.x0 + (samples.x[k] + 0.5) * px;
    const y = frame.y0 + (samples.y[k] + 0.5) * px;
    const i = Math.floor((x - minX) / s), j = Math.floor((y - minY) / s);
    if (i < 0 || j < 0 || i >= cnx || j >= cny) continue;
    const c = j * cnx + i;
    if (pick[c] < 0 || samples.r[k] > samples.r[pick[c]]) pick[c] = k;
  }
  // the disc that set each pixel's value (centre mm, radius mm; radius 0 = only the pixel's own disc)
  const pX = new Float32Array(cnx * cny);
  const pY = new Float32Array(cnx * cny);
  const pR = new Float32Array(cnx * cny);
  /** Raise every coarse pixel whose centre the disc (x, y, r) (mm) covers to τ = 2r; NaN (void) stays NaN. */
  const paint = (x: number, y: number, r: number): void => {
    const tau = 2 * r;
    const ia = Math.max(0, Math.floor((x - r - minX) / s)), ib = Math.min(cnx - 1, Math.floor((x + r - minX) / s));
    const ja = Math.max(0, Math.floor((y - r - minY) / s)), jb = Math.min(cny - 1, Math.floor((y + r - minY) / s));
    for (let j = ja; j <= jb; j++) {
      const cy = minY + (j + 0.5) * s - y;
      for (let i = ia; i <= ib; i++) {
        const cx = minX + (i + 0.5) * s - x;
        if (cx * cx + cy * cy > r * r) continue;
        const q = j * cnx + i;
        if (values[q] < tau) {
          values[q] = tau;
          pX[q] = x;
          pY[q] = y;
          pR[q] = r;
        }
      }
    }
  };
  for (let c = 0; c < pick.length; c++) {
    const k = pick[c];
    if (k < 0) continue;
    const x = frame.x0 + (samples.x[k] + 0.5) * px;
    const y = frame.y0 + (samples.y[k] + 0.5) * px;
    const r = samples.r[k] * px;
    paint(x, y, r);
  }
  // d (mm) carried to each coarse centre to first order (d0, for finding ridges) and its certain lower bound
  // dFine − |c − p| (rIn, the radius painted)
  const geo = set.geo;
  const foot = new Float32Array(2);
  const d0 = new Float32Array(values.length);
  const rIn = new Float32Array(values.length);
  for (let j = 0; j < cny; j++) {
    for (let i = 0; i < cnx; i++) {
      const x = minX + (i + 0.5) * s, y = minY + (j + 0.5) * s;
      const p = fineOf(x, y);
      const q = j * cnx + i;
      if (phase[p] !== 1) {
        d0[q] = NaN;
        continue;
      }
      const dist = field.dist[p];
      if (!(dist > 0 && dist < 1e30)) {
        d0[q] = rIn[q] = Math.min(dist, 1e30) * px;
        continue;
      }
      const pu = p % frame.nx, pv = (p - pu) / frame.nx;
      const du = (x - frame.x0) / px - 0.5 - pu, dv = (y - frame.y0) / px - 0.5 - pv;
      footTo(geo, field.seg[p], pu, pv, foot, 0);
      d0[q] = Math.max(0, dist - (du * foot[0] + dv * foot[1]) / dist) * px;
      rIn[q] = Math.max(0, dist - hypot(du, dv)) * px;
    }
  }
  const at = (i: number, j: number): number => (i < 0 || j < 0 || i >= cnx || j >= cny ? 0 : Number.isNaN(d0[j * cnx + i]) ? 0 : d0[j * cnx + i]);
  const DIRS = [[1, 0], [0, 1], [1, 1], [1, -1]] as const;
  const ridges: number[] = [];
  for (let j = 0; j < cny; j++) {
    for (let i = 0; i < cnx; i++) {
      const r = d0[j * cnx + i];
      if (!(r > s)) continue; // NaN (void) or a disc no wider than a coarse pixel: nothing to add
      // above a neighbour on one side and not below the other ("not below both" is quadratic: see the notes)
      let ridge = false;
      for (const [di, dj] of DIRS) {
        const a = at(i - di, j - dj), b = at(i + di, j + dj);
        if (r >= a && r >= b && (r > a || r > b)) ridge = true;
      }
      if (!ridge) continue;
      // a ridge on the counted medial axis was painted by its medial sample already
      let nearSample = false;
      for (let dj = -1; dj <= 1 && !nearSample; dj++) {
        for (let di = -1; di <= 1; di++) {
          const ii = i + di, jj = j + dj;
          if (ii >= 0 && jj >= 0 && ii < cnx && jj < cny && pick[jj * cnx + ii] >= 0) {
            nearSample = true;
            break;
          }
        }
      }
      if (!nearSample) ridges.push(j * cnx + i);
    }
  }
  // largest first; a disc inside the one that already painted its centre adds nothing
  ridges.sort((a, b) => rIn[b] - rIn[a]);
  for (const c of ridges) {
    const r = rIn[c];
    const i = c % cnx;
    const j = (c - i) / cnx;
    const x = minX + (i + 0.5) * s;
    const y = minY + (j + 0.5) * s;
    if (pR[c] > 0 && hypot(x - pX[c], y - pY[c]) + r <= pR[c] + s) continue;
    paint(x, y, r);
  }
  return { nx: cnx, ny: cny, domain: [minX, minY, minX + cnx * s, minY + cny * s], values };
}

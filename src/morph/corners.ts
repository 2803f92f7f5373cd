/**
 * Concave corners of the solid that a milling tool of radius R cannot reach (docs/notes/morph.md, "Corners").
 *
 * Frame: pixel units of frame.ts inside; results in mm, y up, origin at the lower-left corner of the grid. The
 * raster is padded by more than R: outside the domain is open space the tool may come from.
 * Machinable void = the opening of the void by the disc B_R, from one power distance transform of the tool
 * positions (Felzenszwalb & Huttenlocher 2012, DOI 10.4086/toc.2012.v008a019); uncut pixels grouped by
 * 8-connectivity; each group's corner radius by bisection on the largest disc in the void at its boundary points.
 */
import type { CornerPlace, CornerSurvey } from './types.js';
import { clusterPixels } from './cluster.js';
import { sampledTransform, transformInput } from './edt.js';
import { footTo, type NearestField } from './nearest.js';
import { type Frame, toMm } from './frame.js';
import type { RasterScratch } from './scratch.js';
import { type SegmentSet, segDist2 as segD2 } from './segments.js';
import { hypot } from '../geom/portable-math.js';

/** Smallest turn (radians) towards the void for a polygon vertex to be tried as a corner point. */
const VERTEX_TURN = (15 * Math.PI) / 180;

/** How far (pixel units) a disc may cut into the boundary and still count as fitting. */
const FIT_SLACK = 0.01;

/** Largest sagitta (pixel units) a segment may cut into a disc by in the radius search (see chordFits). */
const SAGITTA_CAP = 0.25;

/** Most ring steps the fit test walks from one candidate segment towards the closest (see chordFits). */
const WALK_MAX = 64;

/** Padding (pixels) the raster needs for tool radius R (mm). */
export function padFor(toolRadius: number, pixel: number): number {
  return Math.ceil(toolRadius / pixel) + 2;
}

/**
 * Corners of the solid a tool of radius `toolRadius` (mm) leaves uncut deeper than `depth` (mm). `scratch`: the
 * engine's raster-sized buffer (scratch.ts) for the transform input and the group tables, else new arrays.
 */
export function cornerSurvey(
  frame: Frame,
  set: SegmentSet,
  field: NearestField,
  phase: Uint8Array,
  toolRadius: number,
  depth: number,
  scratch?: RasterScratch,
): CornerSurvey {
  if (scratch && scratch.pixels !== frame.nx * frame.ny) {
    throw new RangeError(`cornerSurvey: expected a scratch of ${frame.nx * frame.ny} pixels, found ${scratch.pixels}`);
  }
  const run = (f64?: Float64Array, i32?: Int32Array): CornerSurvey => survey(frame, set, field, phase, toolRadius, depth, f64, i32);
  return scratch ? scratch.use(run) : run();
}

/** cornerSurvey with its raster-sized arrays: `f64` (N values) and `i32` (N entries, may share f64's memory), or new ones. */
function survey(
  frame: Frame,
  set: SegmentSet,
  field: NearestField,
  phase: Uint8Array,
  toolRadius: number,
  depth: number,
  f64: Float64Array | undefined,
  i32: Int32Array | undefined,
): CornerSurvey {
  const { nx, ny, box, pixel } = frame;
  const { seg, dist } = field;
  const foot = new Float32Array(2);
  const geo = set.geo;
  const N = nx * ny;
  const R = toolRadius / pixel;

  // distance from (x, y) to the segments held by the 3×3 pixels around it (and `extra`)
  const near = (x: number, y: number, extra: number): number => {
    let best = Infinity;
    if (extra >= 0) best = segD2(geo, extra, x, y);
    const ci = Math.round(x), cj = Math.round(y);
    for (let j = Math.max(0, cj - 1); j <= Math.min(ny - 1, cj + 1); j++) {
      for (let i = Math.max(0, ci - 1); i <= Math.min(nx - 1, ci + 1); i++) {
        const s = seg[j * nx + i];
        if (s >= 0) best = Math.min(best, segD2(geo, s, x, y));
      }
    }
    return Math.sqrt(best);
  };
  // rounding allowance of the fit test (pixel units); chords of a curve get their own in chordFits
  const slack = Math.max(FIT_SLACK, 1e-6 * R);

  // Fit test of the radius search: a segment may cut into the disc by its own sagitta for it (≤ SAGITTA_CAP),
  // unless it ends at a vertex turning sharply into the void (docs/notes/morph.md, step 5)
  const sharp = sharpEnds(set);
  const chordFits = (x: number, y: number, r: number, extra: number): boolean => {
    const ci = Math.round(x), cj = Math.round(y);
    const ok = (s: number): boolean => {
      const d = Math.sqrt(segD2(geo, s, x, y));
      if (d >= r - slack) return true;
      if (sharp[s] === 1) return false;
      const o = 5 * s;
      const q = 0.25 * (geo[o + 2] * geo[o + 2] + geo[o + 3] * geo[o + 3]);
      const sag = Math.min(SAGITTA_CAP, r - Math.sqrt(Math.max(0, r * r - q)));
      return d >= r - slack - sag;
    };
    // walk the ring both ways from each candidate while the segments come closer to (x, y)
    const walkFrom = (s0: number, step: Int32Array): boolean => {
      let s = s0, d = segD2(geo, s0, x, y);
      for (let k = 0; k < WALK_MAX; k++) {
        const t = step[s];
        const dt = segD2(geo, t, x, y);
        if (!(dt < d) || t === s0) break;
        if (!ok(t)) return false;
        s = t; d = dt;
      }
      return true;
    };
    const walk = (s0: number): boolean => ok(s0) && walkFrom(s0, set.prev) && walkFrom(s0, set.next);
    if (extra >= 0 && !walk(extra)) return false;
    for (let j = Math.max(0, cj - 1); j <= Math.min(ny - 1, cj + 1); j++) {
      for (let i = Math.max(0, ci - 1); i <= Math.min(nx - 1, ci + 1); i++) {
        const s = seg[j * nx + i];
        if (s >= 0 && !walk(s)) return false;
      }
    }
    return true;
  };

  // 1. power transform of the tool positions
  const f = (f64 ?? transformInput(N)).fill(Infinity);
  for (let p = 0; p < N; p++) if (phase[p] === 0 && dist[p] >= R) f[p] = -dist[p] * dist[p];
  const pw = sampledTransform(f, nx, ny);

  // 2.–3. uncut pixels with their depth
  const ui: number[] = [], uj: number[] = [], ud: number[] = [];
  const i0 = Math.max(0, Math.ceil(box[0])), i1 = Math.min(nx - 1, Math.floor(box[2]));
  const j0 = Math.max(0, Math.ceil(box[1])), j1 = Math.min(ny - 1, Math.floor(box[3]));
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const p = j * nx + i;
      if (phase[p] !== 0 || seg[p] < 0) continue;
      if (pw.value[p] <= 1e-6 * R * R) continue;
      const s = seg[p];
      const d = dist[p];
      footTo(geo, s, i, j, foot, 0);
      const vx = foot[0], vy = foot[1];
      let nxv: number, nyv: number;
      if (d > 1e-9) { nxv = -vx / d; nyv = -vy / d; } else { nxv = -set.normal[2 * s]; nyv = -set.normal[2 * s + 1]; }
      const fx = i + vx, fy = j + vy;
      if (near(fx + R * nxv, fy + R * nyv, s) >= R - slack) continue;
      const c = pw.arg[p];
      let dep = Infinity;
      if (c >= 0) {
        const ci = c % nx, cj = (c - ci) / nx;
        dep = hypot(i - ci, j - cj) - dist[c];
      }
      ui.push(i); uj.push(j); ud.push(dep);
    }
  }
  const places: CornerPlace[] = [];
  if (ui.length > 0) {
    const ii = Int32Array.from(ui), jj = Int32Array.from(uj);
    // the transform's values are no longer read: its memory may hold the group tables (one after the other)
    const { label, count } = clusterPixels(ii, jj, nx, ny, 0, i32);
    const deepest = new Int32Array(count).fill(-1);
    for (let k = 0; k < ui.length; k++) {
      const c = label[k];
      if (deepest[c] < 0 || ud[k] > ud[deepest[c]]) deepest[c] = k;
    }
    const labelAt = (i32 ?? new Int32Array(N)).fill(-1);
    for (let k = 0; k < ui.length; k++) labelAt[jj[k] * nx + ii[k]] = label[k];
    const members: number[][] = Array.from({ length: count }, () => []);
    for (let k = 0; k < ui.length; k++) members[label[k]].push(k);

    // largest disc inside the void containing boundary point (x, y), centred along unit normal (nx, ny)
    const radiusAt = (x: number, y: number, ux: number, uy: number, s: number): number => {
      const fits = (r: number): boolean => chordFits(x + r * ux, y + r * uy, r, s);
      if (fits(R)) return R;
      let lo = 0, hi = R;
      for (let it = 0; it < 40 && hi - lo > 1e-7 * R; it++) {
        const mid = 0.5 * (lo + hi);
        if (fits(mid)) lo = mid; else hi = mid;
      }
      return lo;
    };

    for (let c = 0; c < count; c++) {
      const kd = deepest[c];
      if (!(ud[kd] * pixel > depth)) continue;
      const dx = ii[kd], dy = jj[kd];
      let bestR = Infinity, bestX = dx, bestY = dy, bestD = Infinity;
      const consider = (x: number, y: number, r: number): void => {
        const dd = hypot(x - dx, y - dy);
        const tol = 1e-3 * R;
        if (r < bestR - tol || (r <= bestR + tol && dd < bestD)) {
          if (r < bestR) bestR = r;
          bestX = x; bestY = y; bestD = dd;
        }
      };
      const tried = new Set<number>();
      for (const k of members[c]) {
        const p = jj[k] * nx + ii[k];
        const s = seg[p];
        const d = dist[p];
        footTo(geo, s, ii[k], jj[k], foot, 0);
        const vx = foot[0], vy = foot[1];
        const fx = ii[k] + vx, fy = jj[k] + vy;
        let ux: number, uy: number;
        const o = 5 * s;
        const t = ((fx - geo[o]) * geo[o + 2] + (fy - geo[o + 1]) * geo[o + 3]) * geo[o + 4];
        if (t > 1e-6 && t < 1 - 1e-6) {
          // normal blended between the end vertices' normals: follows a polygonised curve's normal
          const [ax, ay] = vertexNormal(set, s, 0), [bx, by] = vertexNormal(set, s, 1);
          const mx = (1 - t) * ax + t * bx, my = (1 - t) * ay + t * by;
          const l = hypot(mx, my);
          ux = -mx / l; uy = -my / l;
        } else {
          // foot on a vertex: along its bisector when it turns into the void, else towards the pixel
          const [sa, sb] = t <= 1e-6 ? [set.prev[s], s] : [s, set.next[s]];
          const ax = set.normal[2 * sa], ay = set.normal[2 * sa + 1], bx = set.normal[2 * sb], by = set.normal[2 * sb + 1];
          const l = hypot(ax + bx, ay + by);
          if (ax * by - ay * bx < 0 && l > 1e-9) { ux = -(ax + bx) / l; uy = -(ay + by) / l; } else if (d > 1e-9) {
            ux = -vx / d; uy = -vy / d;
          } else continue;
        }
        consider(fx, fy, radiusAt(fx, fy, ux, uy, s));
        // the end vertex of this segment, when it turns sharply towards the void and lies in this group
        if (tried.has(s)) continue;
        tried.add(s);
        for (const [sa, sb] of [[s, set.next[s]], [set.prev[s], s]]) {
          const ob = 5 * sb;
          const x = geo[ob], y = geo[ob + 1];
          const ax = set.normal[2 * sa], ay = set.normal[2 * sa + 1];
          const bx = set.normal[2 * sb], by = set.normal[2 * sb + 1];
          // turn towards the void: the direction rotates clockwise (solid on the left)
          const turn = Math.atan2(ax * by - ay * bx, ax * bx + ay * by);
          if (!(turn < -VERTEX_TURN)) continue;
          if (!nearLabel(labelAt, nx, ny, x, y, c)) continue;
          const sx = -(ax + bx), sy = -(ay + by);
          const l = hypot(sx, sy);
          if (!(l > 1e-9)) continue;
          consider(x, y, radiusAt(x, y, sx / l, sy / l, sb));
        }
      }
      const m = toMm(frame, bestX, bestY);
      places.push({ x: m.x, y: m.y, radius: Math.min(toolRadius, bestR * pixel) });
    }
    places.sort((a, b) => a.radius - b.radius);
  }
  return { min: places.length > 0 ? places[0].radius : null, places, resolution: 0.5 * pixel };
}

/** Turn (radians) at the vertex where segment a ends and segment b starts; < 0 turns towards the void. */
function turnAt(set: SegmentSet, a: number, b: number): number {
  const n = set.normal;
  const ax = n[2 * a], ay = n[2 * a + 1], bx = n[2 * b], by = n[2 * b + 1];
  return Math.atan2(ax * by - ay * bx, ax * bx + ay * by);
}

/** Per segment: 1 when either end vertex turns towards the void by VERTEX_TURN or more (a real corner). */
function sharpEnds(set: SegmentSet): Uint8Array {
  const out = new Uint8Array(set.n);
  for (let s = 0; s < set.n; s++) {
    if (turnAt(set, set.prev[s], s) <= -VERTEX_TURN || turnAt(set, s, set.next[s]) <= -VERTEX_TURN) out[s] = 1;
  }
  return out;
}

/**
 * Unit solid-side normal at the start (end = 0) or end (end = 1) vertex of segment s: the bisector of the two
 * segments' normals when the vertex turns by less than VERTEX_TURN either way, else segment s's own normal.
 */
function vertexNormal(set: SegmentSet, s: number, end: 0 | 1): [number, number] {
  const n = set.normal;
  const o = end === 0 ? set.prev[s] : set.next[s];
  const turn = end === 0 ? turnAt(set, o, s) : turnAt(set, s, o);
  if (!(Math.abs(turn) < VERTEX_TURN)) return [n[2 * s], n[2 * s + 1]];
  const x = n[2 * s] + n[2 * o], y = n[2 * s + 1] + n[2 * o + 1];
  const l = hypot(x, y);
  return [x / l, y / l];
}

/** Whether a pixel of group `c` lies within one pixel of (x, y). */
function nearLabel(labelAt: Int32Array, nx: number, ny: number, x: number, y: number, c: number): boolean {
  const ci = Math.round(x), cj = Math.round(y);
  for (let j = Math.max(0, cj - 1); j <= Math.min(ny - 1, cj + 1); j++) {
    for (let i = Math.max(0, ci - 1); i <= Math.min(nx - 1, ci + 1); i++) if (labelAt[j * nx + i] === c) return true;
  }
  return false;
}

/** `open-corners` (→ `min-inner-radius`): tight corners closed by a disc of radius R + δ, window by window (docs/notes/repair.md). mm, y up. */
import { cornerDepth } from '../check/min-inner-radius.js';
import type { Morphology } from '../morph/types.js';
import type { PolygonSet, Ring } from '../types.js';
import { booleanOp, ringsOf } from '../geom/clipper.js';
import { addMaterial, arcToleranceOf, closing, marginOf, quantumOf } from './common.js';
import type { RepairInput, StepResult } from './types.js';

/** Half side of a corner's window, in units of ρ: a 30° corner's uncut region reaches ρ/sin 15° ≈ 3.9ρ. */
export const WINDOW = 5;

type Box = [number, number, number, number];

export function openCorners(set: PolygonSet, input: RepairInput, morph: Morphology): StepResult {
  const R = input.limits.toolRadius;
  if (R === null) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: 'no tool radius (--tool-radius or --process)' };
  const survey = morph.corners(R, cornerDepth(input.tolerance, R));
  if (survey.places.length === 0) return { polygons: set, area: 0, locations: [], changed: { polygons: [] }, skipped: null };
  const rho = R + marginOf(input, R, true);
  const quantum = quantumOf(input.domain, rho);
  const h = WINDOW * rho + input.pixel;
  const boxes = mergeBoxes(survey.places.map((p): Box => [p.x - h, p.y - h, p.x + h, p.y + h]));
  const solid = ringsOf(set);
  const extra: Ring[] = [];
  for (const b of boxes) {
    const m = 2 * rho + 2 * input.pixel;
    const near = booleanOp('intersection', solid, [boxRing([b[0] - m, b[1] - m, b[2] + m, b[3] + m])], { quantum });
    if (near.polygons.length === 0) continue;
    const closed = closing(near, rho, arcToleranceOf(input, R), arcToleranceOf(input, R, true), quantum);
    extra.push(...ringsOf(booleanOp('intersection', ringsOf(closed), [boxRing(b)], { quantum })));
  }
  const added = addMaterial(set, extra, input, quantum);
  const locations = survey.places.map((p) => ({ x: p.x, y: p.y, measured: p.radius }));
  return { polygons: added.polygons, area: added.area, locations, changed: added.changed, skipped: null };
}

function boxRing(b: Box): Ring {
  return [[b[0], b[1]], [b[2], b[1]], [b[2], b[3]], [b[0], b[3]]];
}

/** Boxes merged until none overlap. O(n²) passes; corners are few. */
function mergeBoxes(boxes: Box[]): Box[] {
  const out = boxes.map((b) => [...b] as Box);
  let merged = true;
  while (merged) {
    merged = false;
    for (let i = 0; i < out.length && !merged; i++) {
      for (let j = i + 1; j < out.length; j++) {
        const a = out[i], c = out[j];
        if (a[0] > c[2] || c[0] > a[2] || a[1] > c[3] || c[1] > a[3]) continue;
        out[i] = [Math.min(a[0], c[0]), Math.min(a[1], c[1]), Math.max(a[2], c[2]), Math.max(a[3], c[3])];
        out.splice(j, 1);
        merged = true;
        break;
      }
    }
  }
  return out;
}

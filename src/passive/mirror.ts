/**
 * Passive regions under `--mirror`: a half (or quarter) model declares its bolt holes and pads in the input's
 * part of the frame; the unfolded part needs their mirror images too, or the twin of a bolt hole would be only
 * the mirrored contour, not a true circle. docs/passive.md, docs/symmetry.md.
 *
 * Frame: mm, y up, the input grid's frame (the unfolded grid shares it; MirrorPlane.at is in it).
 */
import type { MirrorPlane } from '../geom/symmetry.js';
import type { Point } from '../types.js';
import type { PassiveRegion, PassiveRegions, PassiveShape } from './types.js';

/** The mirror image of a primitive about the line `axis` = `at` (x' = 2·at − x, or y' = 2·at − y). */
export function reflectShape(shape: PassiveShape, plane: Pick<MirrorPlane, 'axis' | 'at'>): PassiveShape {
  const m = (v: number): number => 2 * plane.at - v;
  const onX = plane.axis === 'x';
  switch (shape.kind) {
    case 'circle':
      return onX ? { ...shape, cx: m(shape.cx) } : { ...shape, cy: m(shape.cy) };
    case 'rect':
      return onX ? { ...shape, x0: m(shape.x1), x1: m(shape.x0) } : { ...shape, y0: m(shape.y1), y1: m(shape.y0) };
    case 'polygon':
      // reflection reverses the orientation; regions accept either, so the order is kept
      return { kind: 'polygon', points: shape.points.map((p): Point => (onX ? [m(p[0]), p[1]] : [p[0], m(p[1])])) };
  }
}

function key(r: Pick<PassiveRegion, 'role' | 'shape'>): string {
  return `${r.role}:${JSON.stringify(r.shape)}`;
}

/**
 * The regions and their mirror images about every plane in turn (a quarter model: up to four copies of each),
 * a copy dropped when it is identical to a region already there (a circle centred on the plane is its own
 * image). Copies keep the role, are named "<name> (mirror image)" and their path says which plane made them.
 * No planes: the regions themselves.
 */
export function mirrorPassive(regions: PassiveRegions, planes: readonly Pick<MirrorPlane, 'axis' | 'at'>[]): PassiveRegions {
  if (planes.length === 0) return regions;
  let list: PassiveRegion[] = [...regions.regions];
  const seen = new Set(list.map(key));
  for (const plane of planes) {
    const images: PassiveRegion[] = [];
    for (const r of list) {
      const image: PassiveRegion = {
        role: r.role,
        shape: reflectShape(r.shape, plane),
        name: `${r.name ?? r.path} (mirror image)`,
        path: `${r.path} mirrored about ${plane.axis} = ${plane.at}`,
      };
      const k = key(image);
      if (seen.has(k)) continue;
      seen.add(k);
      images.push(image);
    }
    list = [...list, ...images];
  }
  return { regions: list };
}

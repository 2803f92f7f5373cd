/** Passive regions under `--mirror`: their images, so a mirrored bolt hole is a true circle too (docs/symmetry.md). mm, y up. */
import type { MirrorPlane } from '../geom/symmetry.js';
import type { Point } from '../types.js';
import type { PassiveRegion, PassiveRegions, PassiveShape } from './types.js';

/** The image about the line `axis` = `at`. */
export function reflectShape(shape: PassiveShape, plane: Pick<MirrorPlane, 'axis' | 'at'>): PassiveShape {
  const m = (v: number): number => 2 * plane.at - v;
  const onX = plane.axis === 'x';
  switch (shape.kind) {
    case 'circle':
      return onX ? { ...shape, cx: m(shape.cx) } : { ...shape, cy: m(shape.cy) };
    case 'rect':
      return onX ? { ...shape, x0: m(shape.x1), x1: m(shape.x0) } : { ...shape, y0: m(shape.y1), y1: m(shape.y0) };
    case 'polygon':
      // reflection reverses the orientation; regions accept either
      return { kind: 'polygon', points: shape.points.map((p): Point => (onX ? [m(p[0]), p[1]] : [p[0], m(p[1])])) };
  }
}

function key(r: Pick<PassiveRegion, 'role' | 'shape'>): string {
  return `${r.role}:${JSON.stringify(r.shape)}`;
}

/** The regions and their images about each plane in turn, identical copies dropped; copies named "<name> (mirror image)". */
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

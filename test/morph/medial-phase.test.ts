import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point, PolygonSet } from '../../src/types.js';

/**
 * The phase of a medial sample beside a concave vertex of the solid that is followed by a short edge to a convex
 * vertex (a disc meeting a bar, polygonised: the edge V→W below is 0.29 mm long, about half a pixel). The pixels
 * on either side of it hold the long neighbours as their nearest segments; the root between them is not a medial
 * point (the short edge is closer) and its side was judged by a vertex pseudo-normal that does not apply there.
 *
 * The solid is the polygon below the chain (counter-clockwise, solid on the left of every edge); above it the void
 * is open. At V the void wedge is about 109°: θ = 180° − 109° = 71° < 120°, not counted (Foskey, Lin & Manocha
 * 2003, DOI 10.1145/781606.781623, DOI from memory), so geometry says: no thin void anywhere, and no void sample
 * of any width inside the solid.
 */
const chain: Point[] = [
  [57.8329, 44.3366], [57.4273, 44.4597], [57.0145, 44.5559], [56.5964, 44.6249], [56.1746, 44.6665],
  [55.7509, 44.6804], [55.3273, 44.6665], [54.9055, 44.6249], [54.4873, 44.5559], [54.0746, 44.4597],
  [53.669, 44.3366], [53.2723, 44.1873], [53.0146, 44.0706] /* V: concave */, [52.8191, 44.2793] /* W: convex */,
  [52.4055, 44.6666], [51.9675, 45.0261], [51.5069, 45.3562], [51.0257, 45.6554], [50.526, 45.9225],
  [50.0098, 46.1564], [49.4795, 46.356], [48.9373, 46.5205],
];
const domain = [40, 36, 64, 52] as const;
const pixel = 0.5;

function part(dx: number, dy: number): PolygonSet {
  const outer: Point[] = [...chain, [48.9, 38], [58, 38]].map(([x, y]) => [x + dx, y + dy] as Point);
  return { polygons: [{ outer, holes: [] }] };
}

/** Even-odd ray casting, written here independently of src/geom: whether q is inside `ring`. */
function inside(ring: readonly Point[], q: Point): boolean {
  let c = false;
  for (let k = 0, m = ring.length - 1; k < ring.length; m = k++) {
    const [xi, yi] = ring[k], [xj, yj] = ring[m];
    if ((yi > q[1]) !== (yj > q[1]) && q[0] < ((xj - xi) * (q[1] - yi)) / (yj - yi) + xi) c = !c;
  }
  return c;
}

/** Distance from q to the ring's boundary (plain segment distance). */
function boundaryDistance(ring: readonly Point[], q: Point): number {
  let d = Infinity;
  for (let k = 0; k < ring.length; k++) {
    const a = ring[k], b = ring[(k + 1) % ring.length];
    const ex = b[0] - a[0], ey = b[1] - a[1];
    const t = Math.max(0, Math.min(1, ((q[0] - a[0]) * ex + (q[1] - a[1]) * ey) / (ex * ex + ey * ey)));
    d = Math.min(d, Math.hypot(q[0] - a[0] - t * ex, q[1] - a[1] - t * ey));
  }
  return d;
}

describe('phase of medial samples at a concave vertex followed by a short edge', () => {
  it('geometry: no void sample lies inside the solid, and the void has no thin place (as found on a random part)', () => {
    const s = part(0, 0);
    const m = buildMorphology(s, { domain, pixel });
    // geometry: the void above the chain is open and its wedge at V is 109° (θ = 71°, not counted)
    expect(m.width('void', 4).places).toEqual([]);
    const v = m.medial('void', 100);
    for (let k = 0; k < v.count; k++) expect(inside(s.polygons[0].outer, [v.x[k], v.y[k]]), `void sample at ${v.x[k]}, ${v.y[k]}`).toBe(false);
  });

  it('geometry: under sub-pixel shifts of the same outline every void sample lies in the void and every solid sample in the solid', () => {
    for (let i = 0; i < 6; i++) {
      for (let j = 0; j < 6; j++) {
        const s = part((i * pixel) / 6, (j * pixel) / 6);
        const ring = s.polygons[0].outer;
        const m = buildMorphology(s, { domain, pixel });
        for (const [phase, want] of [['void', false], ['solid', true]] as const) {
          const pts = m.medial(phase, 100);
          for (let k = 0; k < pts.count; k++) {
            const q: Point = [pts.x[k], pts.y[k]];
            // a sample on the boundary itself (radius ~0) has no side; 1e-6 mm is far below any width measured
            if (boundaryDistance(ring, q) < 1e-6) continue;
            expect(inside(ring, q), `shift ${i},${j}: ${phase} sample at ${q[0].toFixed(3)}, ${q[1].toFixed(3)}`).toBe(want);
          }
        }
      }
    }
  });
});

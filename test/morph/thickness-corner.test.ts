/**
 * The local-thickness picture near a blunt convex corner (Hildebrand & Rüegsegger 1997: τ(p) = diameter of the
 * largest disc inside the solid that contains p). Analytic: in a corner of interior angle α, the largest disc
 * containing the point p on the bisector at distance u from the vertex is centred on the bisector at D with
 * radius D·sin(α/2) and reaches back to p when D − u = D·sin(α/2), so τ(p) = 2u·sin(α/2)/(1 − sin(α/2)) — as
 * long as that disc fits in the rest of the part.
 */
import { describe, expect, it } from 'vitest';
import { buildMorphology } from '../../src/morph/index.js';
import type { Point } from '../../src/types.js';

describe('thickness picture near a blunt convex corner', () => {
  it('a point near a 120° vertex of a large hexagon shows the disc of the corner, not its own distance', () => {
    const R = 40; // circumradius = side of a regular hexagon
    const c: Point = [50.1, 50.1]; // so that p below is a coarse pixel centre (0.1 + 0.2·k)
    const outer: Point[] = Array.from({ length: 6 }, (_, k) => [c[0] + R * Math.cos((k * Math.PI) / 3), c[1] + R * Math.sin((k * Math.PI) / 3)] as Point);
    const m = buildMorphology({ polygons: [{ outer, holes: [] }] }, { domain: [0, 0, 100, 100], pixel: 0.1 });
    const map = m.thicknessMap(500);
    const s = (map.domain[2] - map.domain[0]) / map.nx;
    const u = 3; // on the bisector, 3 mm in from the vertex at (90.1, 50.1)
    const p: Point = [c[0] + R - u, c[1]];
    const i = Math.floor((p[0] - map.domain[0]) / s);
    const j = Math.floor((p[1] - map.domain[1]) / s);
    const tau = map.values[j * map.nx + i];
    const sin = Math.sin(Math.PI / 3); // α/2 = 60°
    const expected = (2 * u * sin) / (1 - sin); // ≈ 38.8 mm; its disc (r ≈ 19.4, centre 22.4 from the vertex) fits in the hexagon (inradius 34.6)
    expect(s).toBeCloseTo(0.2, 12);
    // τ is steep in u here (dτ/du = 2·sin/(1 − sin) ≈ 12.9): allow the raster pixel (0.1 mm) of error in u
    const slope = (2 * sin) / (1 - sin);
    expect(Math.abs(tau - expected)).toBeLessThan(slope * 0.1 + 0.5);
    expect(tau).toBeGreaterThan(4 * 2 * u * sin); // far above the point's own disc 2·d = 2u·sin(α/2) ≈ 5.2 mm
  });
});

import { describe, expect, it } from 'vitest';
import { parseLoads } from '../../src/loads/parse.js';
import { resolveLoadCase } from '../../src/loads/resolve.js';

const spec = (supports: object[], loads: object[]) => parseLoads(JSON.stringify({ rhoformLoads: 1, material: { E: 1000, nu: 0.3 }, thickness: 1, supports, loads }), 'r.json');
const grid = { ex: 10, ey: 5, hx: 2, hy: 2 };
const nx = 11;
const fy = (f: Float64Array, i: number, j: number): number => f[2 * (j * nx + i) + 1];

describe('resolveLoadCase: consistent nodal forces', () => {
  it('a uniform line load on an edge: the bilinear element edges give ½h, h, …, h, ½h shares (Zienkiewicz & Taylor, vol. 1, consistent loads)', () => {
    const lc = resolveLoadCase(spec([{ fix: 'xy', edge: 'left' }], [{ force: [0, -100], edge: 'top' }]), grid);
    // total length 20 mm, 10 element edges of 2 mm: ends 5 N, interior 10 N
    expect(fy(lc.force, 0, 5)).toBe(0); // the top-left node is fixed: its share goes to the support
    expect(lc.loads[0].toSupport![1]).toBeCloseTo(-5, 12);
    expect(fy(lc.force, 1, 5)).toBeCloseTo(-10, 12);
    expect(fy(lc.force, 10, 5)).toBeCloseTo(-5, 12);
    expect(lc.loads[0].nodes).toBe(11);
    // every left-edge dof is fixed
    for (let j = 0; j <= 5; j++) expect([lc.fixed[2 * j * nx], lc.fixed[2 * j * nx + 1]]).toEqual([1, 1]);
  });

  it('a segment along a grid line gives the same trapezoid shares; a diagonal one conserves the total', () => {
    const lc = resolveLoadCase(spec([{ fix: 'xy', edge: 'left' }], [{ force: [0, -60], segment: [[4, 6], [10, 6]] }]), grid);
    // 6 mm, 3 element edges: 10, 20, 20, 10 N on x = 4, 6, 8, 10 at y = 6 (node row 3)
    expect([2, 3, 4, 5].map((i) => fy(lc.force, i, 3))).toEqual([-10, -20, -20, -10].map((v) => expect.closeTo(v, 12)));
    const d = resolveLoadCase(spec([{ fix: 'xy', edge: 'left' }], [{ force: [30, -40], segment: [[3.1, 1.2], [17.3, 8.9]] }]), grid);
    let sx = 0;
    let sy = 0;
    for (let n = 0; n < d.force.length / 2; n++) {
      sx += d.force[2 * n];
      sy += d.force[2 * n + 1];
    }
    expect(sx).toBeCloseTo(30, 10);
    expect(sy).toBeCloseTo(-40, 10);
  });

  it('a circle rim catches the nodes within half a cell of it, shares by arc length; a rect gives equal shares; a point its nearest node', () => {
    const lc = resolveLoadCase(
      spec(
        [{ fix: 'xy', edge: 'left' }],
        [
          { force: [0, -80], circle: { center: [10, 4], radius: 2 } },
          { force: [12, 0], rect: { min: [13.5, 1.5], max: [18, 4.5] } },
          { force: [0, 7], point: [19.2, 0.9] },
        ],
      ),
      grid,
    );
    // rim r = 2 around (10, 4) on a 2 mm grid: nodes at distance within 1 mm of 2 mm — the 4 axis neighbours at
    // 2 mm and the 4 diagonal ones at 2.83 mm
    expect(lc.loads[0].nodes).toBe(8);
    expect(fy(lc.force, 6, 2)).toBeCloseTo(-10, 10); // (12, 4): 8 nodes at 45° spacing share equally
    // rect x 13.5…18, y 1.5…4.5: nodes x 14, 16, 18 × y 2, 4 → 6 nodes, 2 N each
    expect(lc.loads[1].nodes).toBe(6);
    expect(lc.force[2 * (1 * nx + 7)]).toBeCloseTo(2, 12);
    // the point (19.2, 0.9) → nearest node (20, 0)
    expect(fy(lc.force, 10, 0)).toBe(7);
  });
});

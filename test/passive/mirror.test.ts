import { describe, expect, it } from 'vitest';
import { mirrorPassive, reflectShape } from '../../src/passive/mirror.js';
import type { PassiveRegions } from '../../src/passive/types.js';

const regions: PassiveRegions = {
  regions: [
    { role: 'void', shape: { kind: 'circle', cx: 10, cy: 5, r: 2 }, name: 'bolt', path: 'regions[0]' },
    { role: 'solid', shape: { kind: 'rect', x0: 2, y0: 1, x1: 6, y1: 3 }, name: null, path: 'regions[1]' },
    { role: 'void', shape: { kind: 'circle', cx: 0, cy: 8, r: 1 }, name: 'on the plane', path: 'regions[2]' },
  ],
};

describe('passive regions under --mirror', () => {
  it('reflects each primitive about the plane: x′ = 2·at − x (analytic reflection)', () => {
    expect(reflectShape({ kind: 'circle', cx: 10, cy: 5, r: 2 }, { axis: 'x', at: 0 })).toEqual({ kind: 'circle', cx: -10, cy: 5, r: 2 });
    expect(reflectShape({ kind: 'rect', x0: 2, y0: 1, x1: 6, y1: 3 }, { axis: 'x', at: 8 })).toEqual({ kind: 'rect', x0: 10, y0: 1, x1: 14, y1: 3 });
    expect(reflectShape({ kind: 'rect', x0: 2, y0: 1, x1: 6, y1: 3 }, { axis: 'y', at: 0 })).toEqual({ kind: 'rect', x0: 2, y0: -3, x1: 6, y1: -1 });
    expect(reflectShape({ kind: 'polygon', points: [[0, 0], [4, 0], [1, 3]] }, { axis: 'y', at: 10 })).toEqual({
      kind: 'polygon',
      points: [[0, 20], [4, 20], [1, 17]],
    });
  });

  it('adds the images, skips a region that is its own image, and keeps roles', () => {
    const out = mirrorPassive(regions, [{ axis: 'x', at: 0 }]);
    expect(out.regions).toHaveLength(5); // 3 + 2 images; the circle centred on x = 0 is its own image
    const bolts = out.regions.filter((r) => r.role === 'void' && r.shape.kind === 'circle' && r.shape.r === 2);
    expect(bolts.map((r) => (r.shape.kind === 'circle' ? r.shape.cx : NaN)).sort((a, b) => a - b)).toEqual([-10, 10]);
    expect(out.regions[3].name).toBe('bolt (mirror image)');
  });

  it('a quarter model gets four copies of an off-axis region (two reflections compose to a point reflection)', () => {
    const one: PassiveRegions = { regions: [regions.regions[0]] };
    const out = mirrorPassive(one, [{ axis: 'x', at: 0 }, { axis: 'y', at: 0 }]);
    const centres = out.regions.map((r) => (r.shape.kind === 'circle' ? `${r.shape.cx},${r.shape.cy}` : '')).sort();
    expect(centres).toEqual(['-10,-5', '-10,5', '10,-5', '10,5']);
  });

  it('no planes: the same regions', () => {
    expect(mirrorPassive(regions, [])).toBe(regions);
  });
});

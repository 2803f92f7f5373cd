/** `peak-stress`: peak von Mises stress (MPa) under `--loads` against `--allowable-stress` (docs/checks/peak-stress.md). */
import type { CheckContext, CheckDefinition, Measurement, RawLocation } from './types.js';

/** One location per edge-connected region of solid elements above `limit` (MPa), at its peak (mm, y up). */
export function stressRegions(ex: number, ey: number, hx: number, hy: number, x0: number, y0: number, fraction: Float64Array, vm: Float64Array, limit: number, solid = 0.5): RawLocation[] {
  const over = (e: number) => fraction[e] >= solid && vm[e] > limit;
  const seen = new Uint8Array(ex * ey);
  const stack: number[] = [];
  const out: RawLocation[] = [];
  for (let e0 = 0; e0 < ex * ey; e0++) {
    if (seen[e0] || !over(e0)) continue;
    seen[e0] = 1;
    stack.push(e0);
    let best = e0;
    while (stack.length > 0) {
      const e = stack.pop()!;
      if (vm[e] > vm[best]) best = e;
      const i = e % ex;
      const j = (e - i) / ex;
      const next = [i > 0 ? e - 1 : -1, i < ex - 1 ? e + 1 : -1, j > 0 ? e - ex : -1, j < ey - 1 ? e + ex : -1];
      for (const m of next) {
        if (m >= 0 && !seen[m] && over(m)) {
          seen[m] = 1;
          stack.push(m);
        }
      }
    }
    const i = best % ex;
    const j = (best - i) / ex;
    out.push({ x: x0 + (i + 0.5) * hx, y: y0 + (j + 0.5) * hy, measured: vm[best] });
  }
  return out;
}

export function measurePeakStress(ctx: CheckContext, limit: number): Measurement {
  const st = ctx.structure;
  const method = 'von Mises stress (MPa) at the centres of elements at least half full, plane stress, bilinear elements on the grid; peaks at sharp corners and point loads grow with refinement';
  if (!st || st.geometry.peakStress === null) return { measured: null, resolution: 0, method, locations: [] };
  const a = st.geometry;
  const [ex, ey] = a.elements;
  const [hx, hy] = a.elementSize;
  return { measured: a.peakStress!.value, resolution: 0, method, locations: stressRegions(ex, ey, hx, hy, st.x0, st.y0, a.fraction, a.vonMises, limit) };
}

export const peakStress: CheckDefinition = {
  id: 'peak-stress',
  unit: 'MPa',
  comparison: '<=',
  measure: measurePeakStress,
};

/**
 * Passive regions end to end through the command line (docs/passive.md): a plate grid, a passive file with a
 * void circle of diameter 10 inside the material, a solid pad and a void notch; the DXF is re-read with
 * dxf-parser 1.1.2 (an independent DXF reader) and the JSON report checked against analytic areas.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ICircleEntity, IDxf, ILwpolylineEntity } from 'dxf-parser';
import { describe, expect, it } from 'vitest';
import { cli, tempDir } from '../cli/harness.js';
import { DxfParser } from '../support/dxf-parser.js';


/** A 60×30 cell plate, 1 mm cells, fully solid except a void band along the top (rows 1–5 of the file). */
function plateCsv(): string {
  const rows: string[] = [];
  for (let r = 0; r < 30; r++) rows.push(Array.from({ length: 60 }, () => (r < 5 ? '0' : '1')).join(','));
  return `${rows.join('\n')}\n`;
}

const passive = {
  rhoformPassive: 1,
  regions: [
    { role: 'void', circle: { center: [20, 12], radius: 5 }, name: 'bolt hole' },
    { role: 'solid', rect: { min: [40, 24], max: [50, 28] }, name: 'pad in the void band' },
  ],
};

function run(extra: string[] = [], file = passive) {
  const dir = tempDir();
  writeFileSync(join(dir, 'plate.csv'), plateCsv());
  writeFileSync(join(dir, 'plate.passive.json'), JSON.stringify(file, null, 2));
  const r = cli(['build', 'plate.csv', '--passive', 'plate.passive.json', '--out-dir', 'out', ...extra], dir);
  return { dir, r };
}

describe('passive regions through build (DXF read back by dxf-parser)', () => {
  it('a passive-void circle of diameter 10 is written as a DXF CIRCLE of radius 5 on layer hole', () => {
    const { dir, r } = run();
    expect(r.code).toBe(0);
    const dxf = new DxfParser().parseSync(readFileSync(join(dir, 'out/plate.dxf'), 'utf8'));
    const circles = (dxf?.entities ?? []).filter((e) => e.type === 'CIRCLE') as ICircleEntity[];
    expect(circles).toHaveLength(1);
    expect(circles[0].layer).toBe('hole'); // DESIGN §8: every hole of the part on `hole`
    expect(circles[0].radius).toBeCloseTo(5, 9); // the file's diameter 10
    expect(circles[0].center.x).toBeCloseTo(20, 9);
    expect(circles[0].center.y).toBeCloseTo(12, 9);
    // the hole is not also written as a polyline: only the outer ring remains an LWPOLYLINE
    const polys = (dxf?.entities ?? []).filter((e) => e.type === 'LWPOLYLINE') as ILwpolylineEntity[];
    expect(polys.map((p) => p.layer)).toEqual(['outline']);
  });

  it("the report states the regions; the pad's edges are exact (bbox top y = 28 from the file) and the area adds up", () => {
    const { dir } = run();
    const report = JSON.parse(readFileSync(join(dir, 'out/plate.report.json'), 'utf8'));
    expect(report.passive).toMatchObject({ file: 'plate.passive.json', solid: 1, void: 1, circles: 1 });
    expect(report.settings.passive).toBe('plate.passive.json');
    // the pad's top edge is the file's y = 28 exactly: exact booleans, not a contour of cells
    expect(report.geometry.bbox).toEqual([0, 0, 60, 28]);
    // final area = smoothed area + what the exact booleans changed, except that the hole is written (and
    // measured) as the true circle instead of its circumscribed polygon: the difference is that polygon's
    // excess over the disc, at most 2π·r·(tolerance / 4) (analytic; its vertices lie within tolerance/16 outside)
    const change = report.geometry.area - (report.smoothing.area + report.passive.area);
    expect(change).toBeGreaterThan(0);
    expect(change).toBeLessThanOrEqual(2 * Math.PI * 5 * (report.smoothing.tolerance / 4));
    // and it is the area the DXF holds: the outline polyline (shoelace) minus the circle, as dxf-parser reads them
    const dxf = new DxfParser().parseSync(readFileSync(join(dir, 'out/plate.dxf'), 'utf8'));
    const outline = (dxf?.entities ?? []).find((e) => e.type === 'LWPOLYLINE') as ILwpolylineEntity;
    const v = outline.vertices;
    const shoelace = v.reduce((a, p, i) => a + p.x * v[(i + 1) % v.length].y - v[(i + 1) % v.length].x * p.y, 0) / 2;
    const circle = (dxf?.entities ?? []).find((e) => e.type === 'CIRCLE') as ICircleEntity;
    expect(report.geometry.area).toBeCloseTo(shoelace - Math.PI * circle.radius ** 2, 6);
    // the disc is removed whole: the final area is below the band-plus-pad area by at least the inscribed
    // polygon of the circle (analytic (n/2) r² sin(2π/n) ≥ 0.99 π r² for the polygonisation used)
    expect(report.geometry.area).toBeLessThan(60 * 28 - 0.99 * Math.PI * 25);
  });

  it('the SVG cuts the circle with two arcs inside the part path', () => {
    const { dir } = run();
    const svg = readFileSync(join(dir, 'out/plate.svg'), 'utf8');
    const d = /<path id="part"[^>]* d="([^"]+)"/.exec(svg)?.[1] ?? /<path[^>]*fill-rule="evenodd"[^>]* d="([^"]+)"/.exec(svg)?.[1] ?? '';
    expect((d.match(/A/g) ?? []).length).toBe(2);
  });

  it('a bad passive file is exit 2 with the key path, and nothing is written', () => {
    const bad = { rhoformPassive: 1, regions: [{ role: 'void', circle: { center: [20, 12], radius: -3 } }] };
    const { dir, r } = run([], bad as unknown as typeof passive);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/E_PASSIVE_FORMAT/);
    expect(r.stderr).toMatch(/plate\.passive\.json:\d+:\d+: regions\[0\]\.circle\.radius/);
    expect(() => readFileSync(join(dir, 'out/plate.dxf'))).toThrow();
  });

  it('a missing passive file is exit 2 naming it', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'plate.csv'), plateCsv());
    const r = cli(['build', 'plate.csv', '--passive', 'nope.json', '--out-dir', 'out'], dir);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/E_INPUT_READ.*nope\.json|nope\.json.*no such file/);
  });
});

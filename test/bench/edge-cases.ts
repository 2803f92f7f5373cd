/**
 * Bench cases for grids that are small or simple but once took minutes (issue 11, item 4): constant fields, a
 * part touching all four domain edges, and a perforated plate whose holes fill-holes fills. Every one runs the
 * whole CLI with the default outputs (DXF, SVG, JSON and the HTML report with its thickness picture), so a
 * stage that is quadratic in the picture or in the boundary shows here. Target: time in proportion to cells +
 * boundary, i.e. well under a second of work for each of these.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';

/** Grid rows as CSV text (first line = top row). */
function csv(rows: number, cols: number, value: (i: number, j: number) => number): string {
  const lines: string[] = [];
  for (let j = rows - 1; j >= 0; j--) {
    const row: string[] = [];
    for (let i = 0; i < cols; i++) row.push(String(value(i, j)));
    lines.push(row.join(','));
  }
  return `${lines.join('\n')}\n`;
}

interface EdgeCase {
  readonly label: string;
  readonly text: string;
  readonly flags: readonly string[];
}

/** 200 × 200 cells of 1 mm with 100 holes of 8 mm diameter on a 20 mm pitch. */
function perforated(i: number, j: number): number {
  const x = i + 0.5, y = j + 0.5;
  const dx = ((x % 20) + 20) % 20 - 10, dy = ((y % 20) + 20) % 20 - 10;
  return dx * dx + dy * dy < 16 ? 0 : 1;
}

export const EDGE_CASES: readonly EdgeCase[] = [
  { label: 'constant 1 × 1, value 1', text: '1\n', flags: [] },
  { label: 'constant 7 × 4, all 1', text: csv(4, 7, () => 1), flags: [] },
  { label: 'constant 400 × 200, all 1', text: csv(200, 400, () => 1), flags: [] },
  { label: 'constant 400 × 200, all 0', text: csv(200, 400, () => 0), flags: [] },
  // a cross whose four arms reach the four domain edges
  { label: 'a cross touching all four edges, 400 × 200', text: csv(200, 400, (i, j) => (Math.abs(i - 200) < 30 || Math.abs(j - 100) < 20 ? 1 : 0)), flags: [] },
  { label: 'perforated plate 200 × 200, --repair --min-hole 10', text: csv(200, 200, perforated), flags: ['--repair', '--min-hole', '10'] },
];

/** Runs every case through `timeCli` (median of `repeat`) and returns Markdown table rows. */
export function edgeCaseRows(dir: string, out: string, timeCli: (args: string[]) => number, repeat: number, what = 'whole process (median wall)'): string[] {
  const rows = [`| edge case (default outputs: DXF, SVG, JSON, HTML) | ${what} |`, '|---|---|'];
  EDGE_CASES.forEach((c, k) => {
    const file = join(dir, `edge-${k}.csv`);
    writeFileSync(file, c.text);
    const walls: number[] = [];
    for (let r = 0; r < repeat; r++) walls.push(timeCli(['build', file, '--out-dir', out, '--force', '--quiet', ...c.flags]));
    walls.sort((a, b) => a - b);
    rows.push(`| ${c.label} | **${walls[Math.floor(walls.length / 2)].toFixed(0)} ms** |`);
    console.error(`done edge case: ${c.label}`);
  });
  return rows;
}

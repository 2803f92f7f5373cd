/**
 * Hand-built sample reports and pictures for the formatter tests (a scenario of our own: a plate with round
 * holes). The numbers are plausible but invented; the tests check how they are shown, not what they are.
 */
import type { ThicknessMap } from '../../src/morph/types.js';
import { CAUTIONS } from '../../src/report/cautions.js';
import type { HtmlPictures } from '../../src/report/html.js';
import { DEFAULT_SETTINGS } from '../../src/settings.js';
import type { CheckResult, DensityGrid, Location, Polygon, Report, ReportSettings, Ring } from '../../src/types.js';

/** Report settings as a run resolves them (defaults, 1 mm cells, tolerance 0.25 mm), with `over` on top. */
export function sampleSettings(over: Partial<ReportSettings> = {}): ReportSettings {
  return { ...DEFAULT_SETTINGS, tolerance: 0.25, layout: 'grid', ...over };
}

export function loc(x: number, y: number, measured: number, cell = 1, ny = 60): Location {
  return { x, y, measured, fileCol: Math.floor(x / cell) + 1, fileRow: ny - Math.floor(y / cell) };
}

export function check(id: string, status: CheckResult['status'], over: Partial<CheckResult> = {}): CheckResult {
  return {
    id,
    status,
    measured: 1,
    limit: 2,
    unit: 'mm',
    comparison: '>=',
    resolution: 0.05,
    method: 'test method',
    message: `${id} message`,
    locations: [],
    locationsTotal: 0,
    ...over,
  };
}

export function sampleChecks(): CheckResult[] {
  const member = [loc(12.5, 40.25, 1.52), loc(30, 10, 1.61), loc(44, 52, 1.7), loc(70, 31, 1.8), loc(88, 8, 1.93)];
  return [
    check('volume-fraction', 'pass', { measured: 0.0002, limit: 0.001, unit: '1', comparison: '<=', resolution: 1e-6, message: 'smoothed area within 0.02 % of the target' }),
    check('min-member-size', 'fail', { measured: 1.52, limit: 2, locations: member, locationsTotal: 12, message: 'members thinner than 2 mm at 12 places' }),
    check('min-hole-size', 'warn', { measured: 2.98, limit: 3, locations: [loc(60, 20, 2.98), loc(100, 45, 2.99)], locationsTotal: 2, message: 'two holes within the resolution of 3 mm' }),
    check('islands', 'pass', { measured: null, limit: 0, unit: 'mm2', message: 'one connected piece' }),
    check('grey-level', 'warn', { measured: 31.2, limit: 25, unit: '%', comparison: '<=', resolution: 0.01, message: 'many intermediate densities: the outline depends on the level' }),
  ];
}

export function sampleReport(over: Partial<Report> = {}): Report {
  const checks = over.checks ?? sampleChecks();
  const count = (s: string) => checks.filter((c) => c.status === s).length;
  const status = count('fail') > 0 ? 'fail' : count('warn') > 0 ? 'warn' : 'pass';
  return {
    schemaVersion: 1,
    tool: { name: 'rhoform', version: '0.1.0' },
    input: { file: 'plate-holes.npy', sha256: 'ab'.repeat(32), format: 'npy', nx: 120, ny: 60, cellSize: [1, 1], min: 0, max: 1, mean: 0.45, greyLevel: 31.2, nonFinite: 0 },
    settings: sampleSettings({ cellSize: [1, 1], cellSizeDefaulted: false, values: 'cells', minMember: 2, minHole: 3, toolRadius: null, process: null, thickness: null }),
    threshold: { mode: 'volume', level: 0.4812, targetFraction: 0.45, achievedFraction: 0.4501, pixelFraction: 0.4493 },
    geometry: { polygons: 1, holes: 3, area: 3240, perimeter: 520, vertices: 400, bbox: [0, 0, 120, 60], finalFraction: 0.45 },
    smoothing: { maxDeviation: 0.12, tolerance: 0.25, rawArea: 3239, area: 3240, rawVertices: 900, vertices: 400 },
    checks,
    repairs: [],
    summary: { status, pass: count('pass'), warn: count('warn'), fail: count('fail') },
    outputs: [
      { file: 'out/plate-holes.dxf', format: 'dxf' },
      { file: 'out/plate-holes.report.html', format: 'html' },
    ],
    warnings: [],
    cautions: [...CAUTIONS],
    ...over,
  };
}

/** A circle ring of `n` points, clockwise when `cw` (a hole). */
export function circle(cx: number, cy: number, r: number, n: number, cw: boolean): Ring {
  const out: [number, number][] = [];
  for (let k = 0; k < n; k++) {
    const a = ((cw ? -1 : 1) * 2 * Math.PI * k) / n;
    out.push([cx + r * Math.cos(a), cy + r * Math.sin(a)]);
  }
  return out;
}

/** Deterministic value noise in [0, 1) (integer hash; no Math.random). */
export function hash01(i: number): number {
  let h = Math.imul(i ^ 0x9e3779b9, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return (h >>> 0) / 2 ** 32;
}

export interface PlateOptions {
  /** Outline points per hole circle. */
  readonly seg?: number;
  /** Amplitude of hash noise added to the densities. */
  readonly noise?: number;
  /** Longer side of the thickness raster, px. */
  readonly thicknessSide?: number;
  /** Fill the thickness raster with hash noise instead of measuring it (for size tests: worst-case PNG). */
  readonly noisyThickness?: boolean;
}

/**
 * Local thickness by brute force on a raster (the definition: the diameter of the largest disc inside the
 * solid that covers the point): every pixel centre c paints the disc of radius d(c) with 2·d(c), keeping the
 * maximum. `d` is the distance to the nearest void (mm), ≤ 0 on void. O(Σ d²) — small rasters only.
 */
function bruteThickness(d: (x: number, y: number) => number, tn: number, tm: number, W: number, H: number): Float32Array {
  const p = W / tn;
  const out = new Float32Array(tn * tm).fill(NaN);
  const dc = new Float64Array(tn * tm);
  for (let j = 0; j < tm; j++) for (let i = 0; i < tn; i++) dc[j * tn + i] = d((i + 0.5) * p, (j + 0.5) * (H / tm));
  for (let j = 0; j < tm; j++) {
    for (let i = 0; i < tn; i++) {
      const r = dc[j * tn + i];
      if (!(r > 0)) continue;
      const rp = r / p;
      const R = Math.floor(rp);
      for (let b = Math.max(0, j - R); b <= Math.min(tm - 1, j + R); b++) {
        for (let a = Math.max(0, i - R); a <= Math.min(tn - 1, i + R); a++) {
          if ((a - i) ** 2 + (b - j) ** 2 > rp * rp) continue;
          const o = b * tn + a;
          if (!(out[o] >= 2 * r)) out[o] = 2 * r;
        }
      }
    }
  }
  for (let o = 0; o < out.length; o++) if (!(dc[o] > 0)) out[o] = NaN;
  return out;
}

/**
 * A plate W × H mm on an nx × ny cell grid with a rows × cols array of round holes: the density (1 in the
 * plate, 0 in the holes, a one-cell ramp between, plus noise), the outline (rectangle + CW circles), the local
 * thickness (brute force, or noise for size tests) and the share-above-level curve of the grid.
 */
export function platePictures(nx: number, ny: number, W: number, H: number, holes: [number, number], o: PlateOptions = {}): HtmlPictures {
  const seg = o.seg ?? 64;
  const noise = o.noise ?? 0;
  const hx = W / nx;
  const hy = H / ny;
  const [rows, cols] = holes;
  const pitchX = W / cols;
  const pitchY = H / rows;
  const rad = 0.3 * Math.min(pitchX, pitchY);
  const holeDist = (x: number, y: number) => {
    const cx = (Math.min(cols - 1, Math.floor(x / pitchX)) + 0.5) * pitchX;
    const cy = (Math.min(rows - 1, Math.floor(y / pitchY)) + 0.5) * pitchY;
    return Math.hypot(x - cx, y - cy) - rad; // distance to the nearest hole edge (the hole of the pitch cell)
  };
  // outside the domain is open space: the plate border is a void boundary too
  const solidDist = (x: number, y: number) => Math.min(holeDist(x, y), x, W - x, y, H - y);
  const values = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const d = holeDist((i + 0.5) * hx, (j + 0.5) * hy) / hx;
      const base = d >= 0.5 ? 1 : d <= -0.5 ? 0 : d + 0.5;
      values[j * nx + i] = Math.min(1, Math.max(0, base + noise * (hash01(j * nx + i) - 0.5)));
    }
  }
  const grid: DensityGrid = { nx, ny, cellSize: [hx, hy], origin: [0, 0], values, placement: 'cells' };
  const holeRings: Ring[] = [];
  for (let a = 0; a < rows; a++) for (let b = 0; b < cols; b++) holeRings.push(circle((b + 0.5) * pitchX, (a + 0.5) * pitchY, rad, seg, true));
  const plate: Polygon = { outer: [[0, 0], [W, 0], [W, H], [0, H]], holes: holeRings };
  const side = o.thicknessSide ?? 240;
  const tn = W >= H ? side : Math.round((side * W) / H);
  const tm = W >= H ? Math.round((side * H) / W) : side;
  let tv: Float32Array;
  if (o.noisyThickness) {
    tv = new Float32Array(tn * tm);
    for (let k = 0; k < tv.length; k++) tv[k] = hash01(k) < 0.2 ? NaN : 10 * hash01(k + 7777777);
  } else tv = bruteThickness(solidDist, tn, tm, W, H);
  const thickness: ThicknessMap = { nx: tn, ny: tm, domain: [0, 0, W, H], values: tv };
  const levels: number[] = [];
  const fractions: number[] = [];
  // share of cells ≥ k/100 from a 101-bin histogram (bin = floor(100·v); one pass, fine for 8M cells)
  const bins = new Float64Array(101);
  for (let q = 0; q < values.length; q++) bins[Math.min(100, Math.floor(100 * values[q]))]++;
  let above = 0;
  for (let k = 100; k >= 0; k--) {
    above += bins[k];
    levels[k] = k / 100;
    fractions[k] = above / values.length;
  }
  return { grid, polygons: { polygons: [plate] }, domain: [0, 0, W, H], thickness, curve: { levels, fractions } };
}

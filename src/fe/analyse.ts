/**
 * The structural re-check of one design on the grid's cells (docs/structure.md): bilinear plane-stress elements,
 * modified SIMP for densities, ersatz material for area fractions (references: docs/notes/fe.md), multigrid-CG.
 * mm, y up; element (i, j) at [x0 + i·hx, x0 + (i+1)·hx] × [y0 + j·hy, …]; forces N, E MPa.
 */
import { RhoformError, UsageError } from '../errors.js';
import { powPortable } from '../geom/portable-math.js';
import { entryLabel, resolveLoadCase, type ResolvedLoadCase } from '../loads/resolve.js';
import type { LoadsSpec } from '../loads/types.js';
import type { PolygonSet } from '../types.js';
import type { SolverStats } from './cg.js';
import { coverage, type CoverageGrid } from './coverage.js';
import { coarsenCells } from './resample.js';
import { freeRigidModes } from './rigid.js';
import { solveElastic, type SolveOptions } from './solve.js';
import { vonMises } from './stress.js';
import { hypot } from '../geom/portable-math.js';

/** Elements analysed without coarsening; 1000 × 500 solve well inside 15 s and 1.2 GB (test/bench/fe.ts). */
export const FE_MAX_ELEMENTS = 500_000;

/** Cell densities, cell area fractions, or the polygons themselves (exact fractions). */
export type FeDesign =
  | { readonly kind: 'density'; readonly values: Float64Array }
  | { readonly kind: 'coverage'; readonly values: Float64Array }
  | { readonly kind: 'geometry'; readonly polygons: PolygonSet };

export type FeGridSpec = CoverageGrid;

export interface FeOptions extends SolveOptions {
  maxElements?: number;
  /** mm, when the loads file gives none (`--thickness`); a different value from the file's is a usage error. */
  thickness?: number;
  /** Elements at least this full count for the peak stress and the largest displacement (default 0.5). */
  solidFraction?: number;
  /** Shared by designs on one grid and load case: resolved once, storage reused. */
  workspace?: FeWorkspace;
}

export interface FeWorkspace {
  stencil?: Float64Array;
  loadCase?: { readonly key: string; readonly lc: ResolvedLoadCase };
}

export interface Located {
  value: number;
  x: number;
  y: number;
}

/** DESIGN §12 `Analysis`; per-element arrays are indexed ej·ex + ei, nodes n = j·(ex + 1) + i. */
export interface FeAnalysis {
  /** f·u, N·mm. */
  compliance: number;
  /** mm, over the nodes of elements at least half full. */
  maxDisplacement: Located;
  /** MPa, at the centre of an element at least half full; null when none is. */
  peakStress: Located | null;
  solver: SolverStats;
  elements: [number, number];
  elementSize: [number, number];
  /** 1 = none; otherwise the integer coarsening factor. */
  coarsened: number;
  levels: number;
  fraction: Float64Array;
  /** MPa, solid-phase stress at each element's centre. */
  vonMises: Float64Array;
  /** mm, [u, v] per node. */
  displacement: Float64Array;
  loadCase: ResolvedLoadCase;
}

/** Smallest integer factor c with ⌈nx/c⌉·⌈ny/c⌉ ≤ max. */
export function coarseningFactor(nx: number, ny: number, max: number): number {
  let c = 1;
  while (Math.ceil(nx / c) * Math.ceil(ny / c) > max) c++;
  return c;
}

function thicknessOf(spec: LoadsSpec, opts: FeOptions): number {
  const t = opts.thickness;
  if (t !== undefined && !(t > 0)) throw new UsageError(`--thickness: expected a thickness > 0 mm, found ${t}`);
  if (spec.thickness !== null && t !== undefined && t !== spec.thickness) {
    throw new UsageError(`--thickness ${t} mm conflicts with "thickness": ${spec.thickness} in ${spec.file}; give it once`);
  }
  const v = spec.thickness ?? t;
  if (v === undefined) throw new RhoformError('E_LOADS_FORMAT', 'thickness: expected a thickness in mm (in the file or by --thickness), found nothing', { file: spec.file });
  return v;
}

/** Throws E_LOADS_CASE for a selector that catches nothing or a load case that leaves the part free to move. */
export function analyse(grid: FeGridSpec, design: FeDesign, spec: LoadsSpec, opts: FeOptions = {}): FeAnalysis {
  const { nx, ny } = grid;
  if (!(Number.isInteger(nx) && Number.isInteger(ny) && nx >= 1 && ny >= 1)) throw new RangeError(`grid size must be positive integers, found ${nx} × ${ny}`);
  if (!(grid.hx > 0 && grid.hy > 0)) throw new RangeError(`cell size must be > 0 mm, found ${grid.hx} × ${grid.hy}`);
  const x0 = grid.x0 ?? 0;
  const y0 = grid.y0 ?? 0;
  const t = thicknessOf(spec, opts);
  const c = coarseningFactor(nx, ny, opts.maxElements ?? FE_MAX_ELEMENTS);
  const ex = Math.ceil(nx / c);
  const ey = Math.ceil(ny / c);
  const hx = (nx * grid.hx) / ex;
  const hy = (ny * grid.hy) / ey;

  let fraction: Float64Array;
  if (design.kind === 'geometry') fraction = coverage(design.polygons, { nx: ex, ny: ey, hx, hy, x0, y0 });
  else {
    if (design.values.length !== nx * ny) throw new RangeError(`design has ${design.values.length} values, expected ${nx} × ${ny}`);
    fraction = coarsenCells(design.values, nx, ny, c).values;
  }

  const { E, nu } = spec.material;
  const { penal, minStiffness: r } = spec.interpolation;
  const stiffness = new Float64Array(ex * ey);
  for (let e = 0; e < stiffness.length; e++) {
    const v = fraction[e];
    const f = Number.isFinite(v) ? Math.min(1, Math.max(0, v)) : 0;
    const s = design.kind === 'density' ? powPortable(f, penal) : f; // the same bits in every engine (geom/portable-math.ts)
    stiffness[e] = E * t * (r + s * (1 - r));
  }

  const ws = opts.workspace;
  const key = `${ex} ${ey} ${hx} ${hy} ${x0} ${y0}`;
  let lc: ResolvedLoadCase;
  if (ws?.loadCase !== undefined && ws.loadCase.key === key) lc = ws.loadCase.lc;
  else {
    lc = resolveLoadCase(spec, { ex, ey, hx, hy, x0, y0 });
    const free = freeRigidModes(ex + 1, ey + 1, hx, hy, lc.fixed);
    if (free.length > 0) {
      const words = free.map((m) => (m === 'rotation' ? 'rotation' : `translation in ${m}`)).join(' and ');
      const held = spec.supports.map((s) => entryLabel(s)).join(', ');
      throw new RhoformError('E_LOADS_CASE', `supports: expected supports that hold the part still (no rigid-body motion), found ${words} left free by ${held}`, { file: spec.file, ...spec.supportsAt });
    }
    if (ws) ws.loadCase = { key, lc };
  }

  const sol = solveElastic({ ex, ey, hx, hy, nu, stiffness, fixed: lc.fixed, force: lc.force }, { ...opts, stencilBuffer: ws?.stencil });
  if (ws) ws.stencil = sol.stencil;
  const u = sol.u;
  let compliance = 0;
  for (let d = 0; d < u.length; d++) compliance += lc.force[d] * u[d];

  const vm = vonMises(ex, ey, hx, hy, E, nu, u);
  const solid = opts.solidFraction ?? 0.5;
  let peak: Located | null = null;
  const nxn = ex + 1;
  const counts = new Uint8Array(nxn * (ey + 1));
  for (let j = 0; j < ey; j++) {
    for (let i = 0; i < ex; i++) {
      const e = j * ex + i;
      if (!(fraction[e] >= solid)) continue;
      const n0 = j * nxn + i;
      counts[n0] = counts[n0 + 1] = counts[n0 + nxn] = counts[n0 + nxn + 1] = 1;
      if (peak === null || vm[e] > peak.value) peak = { value: vm[e], x: x0 + (i + 0.5) * hx, y: y0 + (j + 0.5) * hy };
    }
  }
  const anySolid = peak !== null;
  let maxD: Located = { value: 0, x: x0, y: y0 };
  for (let n = 0; n < nxn * (ey + 1); n++) {
    if (anySolid && !counts[n]) continue;
    const m = hypot(u[2 * n], u[2 * n + 1]);
    if (m > maxD.value) {
      const i = n % nxn;
      maxD = { value: m, x: x0 + i * hx, y: y0 + ((n - i) / nxn) * hy };
    }
  }
  return {
    compliance,
    maxDisplacement: maxD,
    peakStress: peak,
    solver: sol.stats,
    elements: [ex, ey],
    elementSize: [hx, hy],
    coarsened: c,
    levels: sol.levels,
    fraction,
    vonMises: vm,
    displacement: u,
    loadCase: lc,
  };
}

/**
 * The structural re-check of one design on the grid's own cells (DESIGN §12, docs/structure.md): plane-stress
 * bilinear elements, one per cell, with element modulus
 *   input design (densities ρ):        E·(r + ρᵖ(1 − r))   (modified SIMP; Andreassen et al. 2011)
 *   final geometry (area fractions a): E·(r + a(1 − r))    (ersatz material; Allaire, Jouve & Toader,
 *                                       "Structural optimization using sensitivity analysis and a level-set
 *                                       method", J. Comput. Phys. 194:363–393, 2004, DOI 10.1016/j.jcp.2003.09.032)
 * solved by multigrid-preconditioned CG. Above `maxElements` cells the field is coarsened by the smallest
 * integer factor that fits (area-weighted block means; the factor is reported).
 *
 * Frame: mm, y up; element (i, j) spans [x0 + i·hx, x0 + (i+1)·hx] × [y0 + j·hy, …]; forces N, E MPa.
 */
import { RhoformError, UsageError } from '../errors.js';
import { entryLabel, resolveLoadCase, type ResolvedLoadCase } from '../loads/resolve.js';
import type { LoadsSpec } from '../loads/types.js';
import type { PolygonSet } from '../types.js';
import type { SolverStats } from './cg.js';
import { coverage, type CoverageGrid } from './coverage.js';
import { coarsenCells } from './resample.js';
import { freeRigidModes } from './rigid.js';
import { solveElastic, type SolveOptions } from './solve.js';
import { vonMises } from './stress.js';

/**
 * Default largest number of elements analysed without coarsening. Measured (test/bench/fe.ts,
 * docs/structure.md): 1000 × 500 = 500 000 elements solve well inside 15 s and 1.2 GB on the bench machine.
 */
export const FE_MAX_ELEMENTS = 500_000;

/** A design on the grid: cell densities, cell area fractions, or the polygons themselves (exact fractions). */
export type FeDesign =
  | { readonly kind: 'density'; readonly values: Float64Array }
  | { readonly kind: 'coverage'; readonly values: Float64Array }
  | { readonly kind: 'geometry'; readonly polygons: PolygonSet };

/** The analysis grid: cells along x and y, their size (mm) and lower-left corner (mm) — the coverage grid. */
export type FeGridSpec = CoverageGrid;

export interface FeOptions extends SolveOptions {
  /** Largest number of elements before coarsening (default FE_MAX_ELEMENTS). */
  maxElements?: number;
  /** Thickness in mm when the loads file gives none (`--thickness`); a different value from the file's is a usage error. */
  thickness?: number;
  /** Elements at least this full count for the peak stress and the largest displacement (default 0.5). */
  solidFraction?: number;
  /**
   * Shared by several designs analysed on one grid under one load case (create with `{}`): the load case is
   * resolved and checked for rigid-body motion once, and the fine stiffness storage is reused.
   */
  workspace?: FeWorkspace;
}

/** What consecutive analyses on one grid share (see FeOptions.workspace); filled by `analyse`. */
export interface FeWorkspace {
  stencil?: Float64Array;
  loadCase?: { readonly key: string; readonly lc: ResolvedLoadCase };
}

export interface Located {
  value: number;
  x: number;
  y: number;
}

/** DESIGN §12 `Analysis`, plus the fields for pictures. */
export interface FeAnalysis {
  /** f·u, N·mm. */
  compliance: number;
  /** Largest displacement magnitude (mm) over the nodes of elements at least half full, and its node. */
  maxDisplacement: Located;
  /** Peak von Mises stress (MPa) at the centre of an element at least half full, or null when none is. */
  peakStress: Located | null;
  solver: SolverStats;
  /** The grid analysed (after coarsening). */
  elements: [number, number];
  elementSize: [number, number];
  /** 1 = none; otherwise the integer factor of the coarsening. */
  coarsened: number;
  /** Multigrid levels used. */
  levels: number;
  /** Material fraction per element (ρ or a), ej·ex + ei. */
  fraction: Float64Array;
  /** Von Mises stress per element at its centre, MPa (solid-phase stress, every element). */
  vonMises: Float64Array;
  /** Nodal displacements, mm, [u, v] of node n = j·(ex + 1) + i. */
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

/** Analyse one design under the load case of `spec`. Throws E_LOADS_CASE for a selector that catches nothing or a load case that leaves the part free to move. */
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
    const s = design.kind === 'density' ? Math.pow(f, penal) : f;
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
    const m = Math.hypot(u[2 * n], u[2 * n + 1]);
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

/**
 * The structure stage (docs/structure.md, DESIGN §12): the structural re-check of a build under the load case of
 * `--loads`. Three calls, in pipeline order:
 *
 * 1. `structureStart` — after prepare: the **input design**, the prepared grid's densities (range-mapped,
 *    unfolded by `--mirror`, passive samples set) through the optimizer's interpolation; nodal grids through the
 *    mean of each cell's four corners (`nodalToCells`).
 * 2. `structureDesign` — for an outline (after passive regions; with `--repair` before and after it): the
 *    written geometry as exact area fractions of material per element, and what it no longer reaches (reach.ts).
 * 3. `structureStage` — after repair, before write: the readonly record the report and the pictures read.
 *
 * Every design shares one workspace (the resolved load case, its rigid-body check and the fine stiffness
 * storage), so the second and third solves allocate less. Frame: mm, y up, the unfolded grid's own origin.
 */
import type { LoadsSpec } from '../loads/types.js';
import type { DensityGrid, PolygonSet } from '../types.js';
import { analyse, type FeAnalysis, type FeGridSpec, type FeOptions, type FeWorkspace } from './analyse.js';
import { reachFindings, type ReachFinding } from './reach.js';
import { nodalToCells } from './resample.js';

/** One design analysed: the analysis and, for a geometry, what it no longer reaches. */
export interface StructureDesign {
  readonly analysis: FeAnalysis;
  readonly reach: readonly ReachFinding[];
}

/** What the later calls share: the load case, the grid, the options and the input design. */
export interface StructureStart {
  readonly spec: LoadsSpec;
  readonly grid: Required<FeGridSpec>;
  readonly options: FeOptions;
  /** Plate thickness used, mm (the file's or `--thickness`). */
  readonly thickness: number;
  readonly input: StructureDesign;
}

/** The structure stage's record (report `structure`, the checks, the HTML stress figure). */
export interface StructureRecord {
  readonly spec: LoadsSpec;
  readonly thickness: number;
  readonly grid: Required<FeGridSpec>;
  readonly input: StructureDesign;
  /** With `--repair`: the geometry before it. */
  readonly beforeRepair: StructureDesign | null;
  readonly final: StructureDesign;
  /** final.compliance / input.compliance − 1. */
  readonly complianceChange: number;
  /** The final geometry's outline, mm (for the deformed outline of the figure). */
  readonly polygons: PolygonSet;
  /** Solves that did not reach their tolerance, in words (warnings of the run). */
  readonly warnings: readonly string[];
}

/** The element grid and cell values of the input design: cells as they are; nodal samples → cell means. */
function inputCells(grid: DensityGrid): { spec: Required<FeGridSpec>; values: Float64Array } {
  const [hx, hy] = grid.cellSize;
  const [x0, y0] = grid.origin;
  const values = grid.values;
  if (grid.placement === 'nodes') {
    const c = nodalToCells(values, grid.nx, grid.ny);
    return { spec: { nx: c.nx, ny: c.ny, hx, hy, x0, y0 }, values: c.values };
  }
  return { spec: { nx: grid.nx, ny: grid.ny, hx, hy, x0, y0 }, values };
}

/**
 * Analyse the input design. Throws UsageError for a `--thickness` that conflicts with the file's, RhoformError
 * E_LOADS_FORMAT when neither gives one, E_LOADS_CASE for a selector outside the grid or catching no node, or a
 * load case that leaves the part free to move.
 */
export function structureStart(field: { readonly grid: DensityGrid }, spec: LoadsSpec, s: { readonly thickness: number | null; readonly feMaxElements: number }): StructureStart {
  const { spec: grid, values } = inputCells(field.grid);
  const workspace: FeWorkspace = {};
  const options: FeOptions = { maxElements: s.feMaxElements, workspace, ...(s.thickness !== null ? { thickness: s.thickness } : {}) };
  const analysis = analyse(grid, { kind: 'density', values }, spec, options);
  const thickness = spec.thickness ?? (s.thickness as number);
  return { spec, grid, options, thickness, input: { analysis, reach: reachFindings(analysis, null, grid.x0, grid.y0) } };
}

/** Analyse an outline on the same grid and load case (exact area fractions per element). */
export function structureDesign(start: StructureStart, polygons: PolygonSet): StructureDesign {
  const analysis = analyse(start.grid, { kind: 'geometry', polygons }, start.spec, start.options);
  return { analysis, reach: reachFindings(analysis, polygons, start.grid.x0, start.grid.y0) };
}

function unconverged(name: string, a: FeAnalysis, tol: number): string | null {
  const s = a.solver;
  if (s.converged) return null;
  const its = `${s.iterations} iteration${s.iterations === 1 ? '' : 's'}`;
  return `structural re-check: the solve of the ${name} stopped after ${its} at relative residual ${s.relativeResidual.toExponential(2)} (tolerance ${tol.toExponential(0)}); its compliance, displacement and stress are approximate`;
}

/** The record of the stage: the designs analysed, the compliance change, the solver warnings. */
export function structureStage(start: StructureStart, beforeRepair: StructureDesign | null, final: StructureDesign, polygons: PolygonSet): StructureRecord {
  const tol = start.options.tol ?? 1e-8;
  const warnings = [
    unconverged('input design', start.input.analysis, tol),
    beforeRepair ? unconverged('geometry before repair', beforeRepair.analysis, tol) : null,
    unconverged('final geometry', final.analysis, tol),
  ].filter((w): w is string => w !== null);
  return {
    spec: start.spec,
    thickness: start.thickness,
    grid: start.grid,
    input: start.input,
    beforeRepair,
    final,
    complianceChange: final.analysis.compliance / start.input.analysis.compliance - 1,
    polygons,
    warnings,
  };
}

/**
 * The structure stage (docs/structure.md): `structureStart` after prepare (the input design),
 * `structureDesign` per outline, `structureStage` the record before write. One shared workspace. mm, y up.
 */
import type { LoadsSpec } from '../loads/types.js';
import type { DensityGrid, PolygonSet } from '../types.js';
import { analyse, type FeAnalysis, type FeGridSpec, type FeOptions, type FeWorkspace } from './analyse.js';
import { reachFindings, type ReachFinding } from './reach.js';
import { nodalToCells } from './resample.js';

export interface StructureDesign {
  readonly analysis: FeAnalysis;
  readonly reach: readonly ReachFinding[];
}

export interface StructureStart {
  readonly spec: LoadsSpec;
  readonly grid: Required<FeGridSpec>;
  readonly options: FeOptions;
  /** mm: the file's or `--thickness`. */
  readonly thickness: number;
  readonly input: StructureDesign;
}

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
  /** mm. */
  readonly polygons: PolygonSet;
  /** Solves that did not reach their tolerance, in words. */
  readonly warnings: readonly string[];
}

/** Cells as they are; nodal samples → cell means. */
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

/** Throws UsageError for a conflicting `--thickness`, E_LOADS_FORMAT without one, E_LOADS_CASE for a bad selector or a free part. */
export function structureStart(field: { readonly grid: DensityGrid }, spec: LoadsSpec, s: { readonly thickness: number | null; readonly feMaxElements: number }): StructureStart {
  const { spec: grid, values } = inputCells(field.grid);
  const workspace: FeWorkspace = {};
  const options: FeOptions = { maxElements: s.feMaxElements, workspace, ...(s.thickness !== null ? { thickness: s.thickness } : {}) };
  const analysis = analyse(grid, { kind: 'density', values }, spec, options);
  const thickness = spec.thickness ?? (s.thickness as number);
  return { spec, grid, options, thickness, input: { analysis, reach: reachFindings(analysis, null, grid.x0, grid.y0) } };
}

/** An outline (mm) on the same grid and load case, as exact area fractions per element. */
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

/** The record: the designs analysed, the compliance change, the solver warnings. */
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

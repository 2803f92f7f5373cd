/**
 * The write stage: the final outline as the files hold it (DESIGN §8) — the part on its layers `outline` and
 * `hole`, true circles where rings are circles, arcs under `--arcs` — and, rendered on demand, the DXF (R2000 or
 * R12), the SVG, the annotations file `<name>.notes.dxf` (`--annotations`) and the solids (`--formats stl,3mf`).
 * The report's geometry block is measured on `shape`, so it states what the files hold.
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid; the writers convert units and the SVG
 * writer does the only y-down flip.
 */
import { numberFindings } from '../check/findings.js';
import { RhoformError } from '../errors.js';
import { fitOutlineArcs } from './arcs-outline.js';
import type { RingCircle } from '../geom/circle.js';
import { circleRings } from '../geom/circle-rings.js';
import type { PassiveRegions } from '../passive/types.js';
import type { Settings } from '../settings.js';
import type { ArcFitSummary, CheckResult, Domain, PolygonSet, RepairRecord } from '../types.js';
import { annotationExtras } from './annotations.js';
import { writeDxf } from './dxf.js';
import { writeSvg } from './svg.js';
import type { RingBulges, WriterInput } from './types.js';

export interface WriteStageInput {
  /** The final outline. */
  readonly polygons: PolygonSet;
  readonly domain: Domain;
  /** mm: the outline's deviation budget (for recognising circles, fitting arcs, polygonising for solids). */
  readonly tolerance: number;
  /** The passive circles that survived whole (PassiveExactResult.ringCircles). */
  readonly passiveCircles: readonly RingCircle[];
  /** The final checks: their warned and failed locations become numbered findings. */
  readonly checks: readonly CheckResult[];
  /** With `--repair`: what the repairs did and the material they changed. */
  readonly repair: { readonly records: readonly RepairRecord[]; readonly changed: PolygonSet } | null;
  /** The passive regions (drawn on the annotations' `passive` layer; their boundaries bound the arc fit). */
  readonly passive: PassiveRegions | null;
  /** The raw iso-contour (`--arcs` stays within the tolerance of it). */
  readonly raw: PolygonSet;
}

/** The part as the files hold it. */
export interface WrittenShape {
  /** The rings written (with `--arcs`, reduced to the arcs' and lines' end points). */
  readonly polygons: PolygonSet;
  readonly ringCircles: readonly RingCircle[];
  readonly arcs?: RingBulges;
  readonly arcFit?: ArcFitSummary;
}

export interface WriteRecord {
  readonly input: WriterInput;
  readonly shape: WrittenShape;
  dxf(): string;
  /** `<name>.notes.dxf`: the annotation layers alone, not plotting, always R2000. */
  notesDxf(): string;
  svg(): string;
  /** The part extruded by `--thickness` as binary STL or 3MF bytes. */
  solid(format: 'stl' | '3mf'): Uint8Array;
}

let writeSolid: typeof import('./solid.js').writeSolid | null = null;

/** Loads the STL/3MF writers (with the extrusion and earcut), which `solid()` needs; once. */
export async function loadSolidWriter(): Promise<void> {
  writeSolid ??= (await import('./solid.js')).writeSolid;
}

function solidWriter(): typeof import('./solid.js').writeSolid {
  if (writeSolid === null) throw new RhoformError('E_INTERNAL', 'the STL/3MF writers are not loaded: await prepareBuild(settings) with stl or 3mf in settings.formats (or loadSolidWriter())');
  return writeSolid;
}

/**
 * The part as the files will hold it: true circles where rings are circles (`--circles`, passive circles),
 * and the arcs and lines of `--arcs`. The pipeline measures it before the final checks, so `volume-fraction`
 * after a repair judges the area written.
 */
export function writtenShape(
  w: Pick<WriteStageInput, 'polygons' | 'domain' | 'tolerance' | 'passiveCircles' | 'passive' | 'raw'>,
  s: Pick<Settings, 'circles' | 'arcs'>,
): WrittenShape {
  const ringCircles = circleRings(w.polygons, w.passiveCircles, s.circles, w.tolerance);
  const fit = s.arcs ? fitOutlineArcs({ polygons: w.polygons, ringCircles, passive: w.passive, domain: w.domain, tolerance: w.tolerance, raw: w.raw }) : null;
  return fit ? { polygons: fit.polygons, ringCircles, arcs: fit.bulges, arcFit: fit.summary } : { polygons: w.polygons, ringCircles };
}

/** The files of the final outline; `shape` when the pipeline already measured it (writtenShape of the same input). */
export function writeStage(
  w: WriteStageInput,
  s: Pick<Settings, 'units' | 'circles' | 'arcs' | 'annotations' | 'dxfVersion' | 'thickness'>,
  shape: WrittenShape = writtenShape(w, s),
): WriteRecord {
  const { ringCircles } = shape;
  const input: WriterInput = {
    polygons: shape.polygons,
    domain: w.domain,
    units: s.units,
    ringCircles,
    ...(shape.arcs ? { arcs: shape.arcs } : {}),
    dxfVersion: s.dxfVersion,
  };
  const extras = () =>
    annotationExtras({ passive: w.passive, findings: numberFindings(w), repaired: w.repair?.changed ?? null, repairs: w.repair?.records ?? [], tolerance: w.tolerance });
  return {
    input,
    shape,
    dxf: () => writeDxf(input),
    notesDxf: () => writeDxf({ polygons: { polygons: [] }, domain: w.domain, units: s.units, extras: extras() }),
    svg: () => writeSvg(s.annotations ? { ...input, extras: extras() } : input),
    solid: (format) => solidWriter()(format, { polygons: shape.polygons, ringCircles, ...(shape.arcs ? { arcs: shape.arcs } : {}), thickness: s.thickness, tolerance: w.tolerance }),
  };
}

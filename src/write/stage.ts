/**
 * The write stage: the final outline and the findings as the geometry files (DXF, SVG) — the part on its
 * layers, true circles where rings are circles, and the annotation layers (`finding`, `repair`).
 *
 * Frame: mm, y up, origin at the lower-left corner of the input grid; the writers convert units and the SVG
 * writer does the only y-down flip.
 */
import { numberFindings } from '../check/findings.js';
import type { RingCircle } from '../geom/circle.js';
import { circleRings } from '../geom/circle-rings.js';
import { ringsOf } from '../geom/clipper.js';
import type { Settings } from '../settings.js';
import type { CheckResult, Domain, PolygonSet, RepairRecord } from '../types.js';
import { writeDxf } from './dxf.js';
import { writeSvg } from './svg.js';
import type { WriterExtra, WriterInput } from './types.js';

export interface WriteStageInput {
  /** The final outline. */
  readonly polygons: PolygonSet;
  readonly domain: Domain;
  /** mm: the outline's deviation budget (for recognising circles). */
  readonly tolerance: number;
  /** The passive circles that survived whole (PassiveExactResult.ringCircles). */
  readonly passiveCircles: readonly RingCircle[];
  /** The final checks: their warned and failed locations become numbered findings. */
  readonly checks: readonly CheckResult[];
  /** With `--repair`: what the repairs did and the material they changed. */
  readonly repair: { readonly records: readonly RepairRecord[]; readonly changed: PolygonSet } | null;
}

export interface WriteRecord {
  readonly input: WriterInput;
  dxf(): string;
  svg(): string;
}

/** The writers' input, and the files rendered on demand (the CLI asks only for the formats it writes). */
export function writeStage(w: WriteStageInput, s: Pick<Settings, 'units' | 'circles'>): WriteRecord {
  const findings = numberFindings(w);
  const extras: WriterExtra[] = [];
  if (findings.length > 0) {
    extras.push({ layer: 'finding', markers: findings.map((f) => ({ x: f.location.x, y: f.location.y, label: String(f.n), note: f.checkId })) });
  }
  if (w.repair) {
    // Where the repairs acted: the material they changed, and R<k> markers as in the HTML report.
    const markers = w.repair.records.flatMap((r, k) => r.locations.map((L) => ({ x: L.x, y: L.y, label: `R${k + 1}`, note: r.id })));
    extras.push({ layer: 'repair', rings: ringsOf(w.repair.changed), markers });
  }
  const input: WriterInput = {
    polygons: w.polygons,
    domain: w.domain,
    units: s.units,
    extras,
    ringCircles: circleRings(w.polygons, w.passiveCircles, s.circles, w.tolerance),
  };
  return { input, dxf: () => writeDxf(input), svg: () => writeSvg(input) };
}

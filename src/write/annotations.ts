/**
 * The annotation layers of a build (`--annotations`): passive-region references, the numbered findings and
 * where the repairs acted, as WriterExtra entries for `<name>.notes.dxf` and the SVG's annotation groups.
 *
 * Repair regions are the union of what every repair round changed (the boolean engine, positive fill), opened
 * by 1 µm (an inward then an outward offset) so that zero-width spikes, where a ring runs out and back along
 * one line, are gone: each region is drawn as simple rings — never a self-crossing ring, which a CAD program
 * cannot make a region of.
 * Frame: mm, y up.
 */
import { booleanOp, offsetRings, ringsOf } from '../geom/clipper.js';
import { ringArea, ringPerimeter } from '../geom/area.js';
import { shapeRing } from '../passive/rings.js';
import type { PassiveRegions } from '../passive/types.js';
import type { Point, PolygonSet, RepairRecord, Ring } from '../types.js';
import type { WriterExtra, WriterMarker } from './types.js';
import { hypot } from '../geom/portable-math.js';

export interface AnnotationInput {
  readonly passive: PassiveRegions | null;
  /** Numbered findings: location and number (src/report/findings.ts). */
  readonly findings: readonly { readonly n: number; readonly checkId: string; readonly location: { readonly x: number; readonly y: number } }[];
  /** Material the repairs added or removed (may overlap across repairs and rounds), or null without repair. */
  readonly repaired: PolygonSet | null;
  readonly repairs: readonly RepairRecord[];
  /** mm: polygonisation tolerance of passive shapes other than circles (circles are written as circles). */
  readonly tolerance: number;
}

/** The annotation layers, in drawing order passive, finding, repair; a layer with nothing to draw is left out. */
export function annotationExtras(a: AnnotationInput): WriterExtra[] {
  const extras: WriterExtra[] = [];
  if (a.passive && a.passive.regions.length > 0) {
    const circles = a.passive.regions.flatMap((r) => (r.shape.kind === 'circle' ? [{ x: r.shape.cx, y: r.shape.cy, r: r.shape.r }] : []));
    const rings = a.passive.regions.filter((r) => r.shape.kind !== 'circle').map((r) => shapeRing(r.shape, a.tolerance));
    extras.push({ layer: 'passive', circles, rings });
  }
  if (a.findings.length > 0) {
    extras.push({ layer: 'finding', markers: a.findings.map((f) => ({ x: f.location.x, y: f.location.y, label: String(f.n), note: f.checkId })) });
  }
  if (a.repaired) {
    // Where the repairs acted: the material they changed, and R<k> markers as in the HTML report.
    const markers: WriterMarker[] = a.repairs.flatMap((r, k) => r.locations.map((L) => ({ x: L.x, y: L.y, label: `R${k + 1}`, note: r.id })));
    const rings = a.repaired.polygons.length > 0 ? simpleRegions(a.repaired) : [];
    if (rings.length + markers.length > 0) extras.push({ layer: 'repair', rings, markers });
  }
  return extras;
}

/** How far (mm) the repair regions are opened: 1 µm, the shortest segment written. */
const OPEN_MM = 0.001;

/** The union of the changed regions, opened by OPEN_MM (miter joins keep the corners). */
function simpleRegions(set: PolygonSet) {
  const union = booleanOp('union', ringsOf(set), [], { fill: 'positive' });
  const opts = { join: 'miter' as const, miterLimit: 4, arcTolerance: OPEN_MM / 4 };
  const opened = ringsOf(offsetRings(ringsOf(offsetRings(ringsOf(union), -OPEN_MM, opts)), OPEN_MM, opts));
  // a ring thinner on average than the opening is a sliver the rounding could fold over itself
  return opened.map(withoutSpikes).filter((r) => r.length >= 3 && Math.abs(ringArea(r)) > OPEN_MM * ringPerimeter(r));
}

/**
 * The ring without its spikes: a vertex where the outline turns back on itself (the two edges at it point in
 * opposite directions within 1°, so the ring runs out and back along one line) is dropped, until none is left.
 */
function withoutSpikes(ring: Ring): Ring {
  let pts = [...ring];
  const cosLimit = Math.cos((179 * Math.PI) / 180);
  for (let changed = true; changed && pts.length >= 3; ) {
    changed = false;
    const out: Point[] = [];
    for (let i = 0; i < pts.length; i++) {
      const a = out.length > 0 ? out[out.length - 1] : pts[(i + pts.length - 1) % pts.length];
      const b = pts[i];
      const c = pts[(i + 1) % pts.length];
      const ux = b[0] - a[0], uy = b[1] - a[1], vx = c[0] - b[0], vy = c[1] - b[1];
      const len = hypot(ux, uy) * hypot(vx, vy);
      if (len > 0 && (ux * vx + uy * vy) / len < cosLimit) {
        changed = true;
        continue;
      }
      out.push(b);
    }
    pts = out;
  }
  return pts;
}

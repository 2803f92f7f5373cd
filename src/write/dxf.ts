/**
 * DXF writer: PolygonSet (mm, y up) → an AutoCAD R2000 (AC1015) ASCII DXF drawing.
 *
 * File layout and group codes per the DXF Reference (Autodesk, AutoCAD DXF) as summarised in docs/references.md §7:
 * - every ring is a closed LWPOLYLINE (90 = vertex count, 70 = 1 closed, the first vertex not repeated);
 *   outer rings on layer `outline`, holes on layer `hole`;
 * - a ring listed in `ringCircles` is a CIRCLE instead (10/20/30 centre, 40 radius; DXF Reference, CIRCLE
 *   group codes), in the ring's place in the entity order, on layer `passive` when the entry says so, else on
 *   the ring's own layer;
 * - extras: rings → closed LWPOLYLINE, circles → CIRCLE, markers → POINT + TEXT, on their own layer;
 * - `$INSUNITS` 4 (mm) or 1 (in) and `$MEASUREMENT` 1 or 0; coordinates are divided by 25.4 for inches;
 * - y stays up (DXF's world frame is y up, like the model); z is 0 everywhere;
 * - numbers with at most 6 decimals, no exponent, no "-0"; CRLF line ends; handles are assigned in a fixed
 *   order, so the same input always gives the same bytes.
 */
import { RhoformError } from '../errors.js';
import type { Ring } from '../types.js';
import {
  blocksSection,
  classesSection,
  FIRST_ENTITY_HANDLE,
  H,
  headerSection,
  objectsSection,
  tablesSection,
} from './dxf-sections.js';
import { DXF_DECIMALS, DxfTags, EOL, hex } from './dxf-tags.js';
import { dxfText } from './dxf-text.js';
import { ringCircleLookup } from './ring-circles.js';
import { checkDomain, checkRadius, ringLength, unitDivisor } from './rings.js';
import { TextSink } from './text-sink.js';
import type { RingCircle, WriterInput } from './types.js';

/** Text height of marker labels as a share of the larger domain side. */
const LABEL_HEIGHT_SHARE = 0.02;
const X = `${EOL} 10${EOL}`;
const Y = `${EOL} 20${EOL}`;
const Z0 = `${EOL} 30${EOL}0`;

/**
 * Writes the part and the optional extra layers as an R2000 DXF string (CRLF line ends).
 *
 * Input: mm, y up, origin at the lower-left corner of the grid; outer rings counter-clockwise, holes
 * clockwise, rings implicitly closed (a repeated closing point is dropped; rings of fewer than 3 points are
 * skipped). Rings listed in `input.ringCircles` are written as CIRCLE entities (centre and radius in mm,
 * converted like every coordinate). Output coordinates and lengths are in `input.units`; `$EXTMIN`/`$EXTMAX`
 * and `$LIMMIN`/`$LIMMAX` are the domain corners in those units.
 * Throws RhoformError `E_INTERNAL` for a RingCircle naming no ring, a radius ≤ 0 or a non-finite value.
 * Pure and deterministic: the same input gives byte-identical output.
 */
export function writeDxf(input: WriterInput): string {
  const [minX, minY, maxX, maxY] = checkDomain(input.domain);
  const div = unitDivisor(input.units);
  const extras = input.extras ?? [];
  const circleOf = ringCircleLookup(input.polygons, input.ringCircles);

  // Handles are numbered in writing order, so $HANDSEED (the next free handle) is known before writing.
  let count = 0;
  let vertices = 0;
  input.polygons.polygons.forEach((p, i) => {
    for (let k = 0; k <= p.holes.length; k++) {
      if (circleOf(i, k) !== undefined) {
        count++;
        continue;
      }
      const n = ringLength(k === 0 ? p.outer : p.holes[k - 1]);
      if (n > 0) count++;
      vertices += n;
    }
  });
  for (const e of extras) {
    for (const r of e.rings ?? []) if (ringLength(r) > 0) count++;
    count += (e.circles?.length ?? 0) + 2 * (e.markers?.length ?? 0);
  }

  const fixed = new DxfTags();
  const header = {
    insunits: input.units === 'in' ? 1 : 4,
    measurement: input.units === 'in' ? 0 : 1,
    extmin: [minX / div, minY / div],
    extmax: [maxX / div, maxY / div],
    handseed: FIRST_ENTITY_HANDLE + count,
  } as const;
  headerSection(fixed, header);
  classesSection(fixed);
  tablesSection(fixed, header);
  blocksSection(fixed);
  fixed.tag(0, 'SECTION').tag(2, 'ENTITIES');

  const out = new TextSink(8192 + 200 * count + 36 * vertices);
  out.str(fixed.text());
  let handle = FIRST_ENTITY_HANDLE;
  const owner = hex(H.modelSpace);
  /** Starts an entity: type, handle, owner, layer and subclass; leaves the cursor after the subclass value. */
  const start = (type: string, layer: string, subclass: string): void => {
    out.str(`  0${EOL}${type}${EOL}  5${EOL}${hex(handle++)}${EOL}330${EOL}${owner}${EOL}100${EOL}AcDbEntity`);
    out.str(`${EOL}  8${EOL}${layer}${EOL}100${EOL}${subclass}`);
  };
  const xy = (x: number, y: number): void => {
    out.str(X).num(x / div, DXF_DECIMALS).str(Y).num(y / div, DXF_DECIMALS);
  };
  const polyline = (ring: Ring, layer: string): void => {
    const n = ringLength(ring);
    if (n === 0) return;
    start('LWPOLYLINE', layer, 'AcDbPolyline');
    out.str(`${EOL} 90${EOL}${n}${EOL} 70${EOL}1`);
    for (let i = 0; i < n; i++) xy(ring[i][0], ring[i][1]);
    out.str(EOL);
  };
  /** A CIRCLE entity; centre and radius in mm, written in output units. */
  const circle = (x: number, y: number, r: number, layer: string): void => {
    start('CIRCLE', layer, 'AcDbCircle');
    xy(x, y);
    out.str(`${Z0}${EOL} 40${EOL}`).num(r / div, DXF_DECIMALS).str(EOL);
  };
  const ringCircle = (c: RingCircle, own: string): void => circle(c.x, c.y, c.r, c.layer ?? own);

  input.polygons.polygons.forEach((polygon, i) => {
    const outer = circleOf(i, 0);
    if (outer !== undefined) ringCircle(outer, 'outline');
    else polyline(polygon.outer, 'outline');
    polygon.holes.forEach((hole, h) => {
      const c = circleOf(i, h + 1);
      if (c !== undefined) ringCircle(c, 'hole');
      else polyline(hole, 'hole');
    });
  });
  const labelHeight = (Math.max(maxX - minX, maxY - minY) * LABEL_HEIGHT_SHARE) / div;
  for (const extra of extras) {
    const layer = extra.layer;
    for (const ring of extra.rings ?? []) polyline(ring, layer);
    for (const c of extra.circles ?? []) circle(c.x, c.y, checkRadius(c.r), layer);
    for (const m of extra.markers ?? []) {
      start('POINT', layer, 'AcDbPoint');
      xy(m.x, m.y);
      out.str(`${Z0}${EOL}`);
      // The label sits up and right of its point by half a text height.
      start('TEXT', layer, 'AcDbText');
      xy(m.x + (labelHeight * div) / 2, m.y + (labelHeight * div) / 2);
      out.str(`${Z0}${EOL} 40${EOL}`).num(labelHeight, DXF_DECIMALS);
      const text = m.note ? `${m.label} ${m.note}` : m.label;
      out.str(`${EOL}  1${EOL}${dxfText(text)}${EOL}100${EOL}AcDbText${EOL}`);
    }
  }
  if (handle !== header.handseed) {
    throw new RhoformError('E_INTERNAL', `expected ${header.handseed} entity handles, found ${handle}`);
  }

  const tail = new DxfTags();
  tail.tag(0, 'ENDSEC');
  objectsSection(tail);
  tail.tag(0, 'EOF');
  return out.str(tail.text()).text();
}

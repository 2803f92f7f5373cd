/**
 * DXF writer: PolygonSet (mm, y up) → an AutoCAD R2000 (AC1015) ASCII DXF drawing.
 *
 * File layout and group codes per the DXF Reference (Autodesk, AutoCAD DXF) as summarised in SOURCES.md §7:
 * - every ring is a closed LWPOLYLINE (90 = vertex count, 70 = 1 closed, the first vertex not repeated);
 *   outer rings on layer `outline`, holes on layer `hole`;
 * - extras: rings → closed LWPOLYLINE, circles → CIRCLE, markers → POINT + TEXT, on their own layer;
 * - `$INSUNITS` 4 (mm) or 1 (in) and `$MEASUREMENT` 1 or 0; coordinates are divided by 25.4 for inches;
 * - y stays up (DXF's world frame is y up, like the model); z is 0 everywhere;
 * - numbers with at most 6 decimals, no exponent, no "-0"; CRLF line ends; handles are assigned in a fixed
 *   order, so the same input always gives the same bytes.
 */
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
import { formatNumber } from './number.js';
import { checkDomain, checkRadius, ringLength, unitDivisor } from './rings.js';
import type { WriterInput } from './types.js';

/** Text height of marker labels as a share of the larger domain side. */
const LABEL_HEIGHT_SHARE = 0.02;

/**
 * Writes the part and the optional extra layers as an R2000 DXF string (CRLF line ends).
 *
 * Input: mm, y up, origin at the lower-left corner of the grid; outer rings counter-clockwise, holes
 * clockwise, rings implicitly closed (a repeated closing point is dropped; rings of fewer than 3 points are
 * skipped). Output coordinates are in `input.units`; `$EXTMIN`/`$EXTMAX` are the domain corners.
 * Pure and deterministic: the same input gives byte-identical output.
 */
export function writeDxf(input: WriterInput): string {
  const [minX, minY, maxX, maxY] = checkDomain(input.domain);
  const div = unitDivisor(input.units);
  const entities = new DxfTags();
  let handle = FIRST_ENTITY_HANDLE;
  const owner = hex(H.modelSpace);
  const fmt = (v: number): string => formatNumber(v / div, DXF_DECIMALS);

  const polyline = (ring: Ring, layer: string): void => {
    const n = ringLength(ring);
    if (n === 0) return;
    const parts = entities.parts;
    parts.push(
      `  0${EOL}LWPOLYLINE${EOL}  5${EOL}${hex(handle++)}${EOL}330${EOL}${owner}${EOL}100${EOL}AcDbEntity${EOL}` +
        `  8${EOL}${layer}${EOL}100${EOL}AcDbPolyline${EOL} 90${EOL}${n}${EOL} 70${EOL}1`,
    );
    for (let i = 0; i < n; i++) {
      const p = ring[i];
      parts.push(` 10${EOL}${fmt(p[0])}${EOL} 20${EOL}${fmt(p[1])}`);
    }
  };
  const common = (type: string, layer: string, subclass: string): void => {
    entities.tag(0, type).tag(5, hex(handle++)).tag(330, owner).tag(100, 'AcDbEntity').tag(8, layer);
    entities.tag(100, subclass);
  };

  for (const polygon of input.polygons.polygons) {
    polyline(polygon.outer, 'outline');
    for (const hole of polygon.holes) polyline(hole, 'hole');
  }

  const labelHeight = (Math.max(maxX - minX, maxY - minY) * LABEL_HEIGHT_SHARE) / div;
  for (const extra of input.extras ?? []) {
    const layer = extra.layer;
    for (const ring of extra.rings ?? []) polyline(ring, layer);
    for (const c of extra.circles ?? []) {
      common('CIRCLE', layer, 'AcDbCircle');
      entities.tag(10, fmt(c.x)).tag(20, fmt(c.y)).tag(30, '0').tag(40, fmt(checkRadius(c.r)));
    }
    for (const m of extra.markers ?? []) {
      common('POINT', layer, 'AcDbPoint');
      entities.tag(10, fmt(m.x)).tag(20, fmt(m.y)).tag(30, '0');
      common('TEXT', layer, 'AcDbText');
      const x = m.x / div + labelHeight / 2;
      const y = m.y / div + labelHeight / 2;
      entities.tag(10, x).tag(20, y).tag(30, 0).tag(40, labelHeight).tag(1, dxfText(m.label));
      entities.tag(100, 'AcDbText');
    }
  }

  const out = new DxfTags();
  const header = {
    insunits: input.units === 'in' ? 1 : 4,
    measurement: input.units === 'in' ? 0 : 1,
    extmin: [minX / div, minY / div],
    extmax: [maxX / div, maxY / div],
    handseed: handle,
  } as const;
  headerSection(out, header);
  classesSection(out);
  tablesSection(out, header);
  blocksSection(out);
  out.tag(0, 'SECTION').tag(2, 'ENTITIES');
  for (const part of entities.parts) out.raw(part);
  out.tag(0, 'ENDSEC');
  objectsSection(out);
  out.tag(0, 'EOF');
  return out.text();
}

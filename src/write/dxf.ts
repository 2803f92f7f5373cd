/**
 * DXF writer: PolygonSet (mm, y up) → an ASCII DXF drawing, AutoCAD R2000 (AC1015, the default) or R12
 * (AC1009, src/write/dxf-r12.ts).
 *
 * File layout and group codes per the DXF Reference (Autodesk, AutoCAD DXF) as summarised in docs/references.md §7:
 * - every ring is a closed LWPOLYLINE (90 = vertex count, 70 = 1 closed, the first vertex not repeated; 42 =
 *   bulge of the edge that starts at a vertex, when arcs are written); outer rings on layer `outline`, holes on
 *   layer `hole`;
 * - a ring listed in `ringCircles` is a CIRCLE instead (10/20/30 centre, 40 radius; DXF Reference, CIRCLE
 *   group codes), in the ring's place in the entity order, on the ring's own layer;
 * - rings are written as the file holds them (src/geom/clean-ring.ts): 6 decimals in the output unit, no
 *   segment shorter than 1 µm;
 * - annotations (extras): rings → closed LWPOLYLINE, circles → CIRCLE, markers → POINT + TEXT, each on its own
 *   layer, declared not to plot (LAYER 290 = 0);
 * - `$INSUNITS` 4 (mm) or 1 (in) and `$MEASUREMENT` 1 or 0; coordinates are divided by 25.4 for inches;
 *   `$EXTMIN`/`$EXTMAX` are the bounds of the entities written;
 * - y stays up (DXF's world frame is y up, like the model); z is 0 everywhere;
 * - numbers with at most 6 decimals, no exponent, no "-0"; CRLF line ends; handles are assigned in a fixed
 *   order, so the same input always gives the same bytes.
 */
import { RhoformError } from '../errors.js';
import {
  blocksSection,
  classesSection,
  DXF_LAYERS,
  FIRST_ENTITY_HANDLE,
  H,
  headerSection,
  objectsSection,
  tablesSection,
  type DxfLayer,
} from './dxf-sections.js';
import { writeDxfR12 } from './dxf-r12.js';
import { DXF_DECIMALS, DxfTags, EOL, hex } from './dxf-tags.js';
import { dxfText } from './dxf-text.js';
import { collectDrawing, type Drawing } from './drawing.js';
import { TextSink } from './text-sink.js';
import type { WriterInput } from './types.js';

const X = `${EOL} 10${EOL}`;
const Y = `${EOL} 20${EOL}`;
const Z0 = `${EOL} 30${EOL}0`;

/** The layers a file declares: '0'; the part's layers unless the file holds annotations only; the annotation layers when any is given. */
export function declaredLayers(input: WriterInput): DxfLayer[] {
  const notes = (input.extras ?? []).length > 0;
  const part = !notes || input.polygons.polygons.length > 0;
  return DXF_LAYERS.filter((l) => l.name === '0' || (l.plot ? part : notes));
}

/**
 * Writes the part and the optional annotation layers as a DXF string, R2000 unless `input.dxfVersion` is 'r12'.
 * Rings that clean to fewer than 3 points are skipped; `$EXTMIN`/`$EXTMAX` are the bounds of what is drawn (the
 * domain corners for an empty drawing), `$LIMMIN`/`$LIMMAX` the domain. Throws RhoformError `E_INTERNAL` for a
 * RingCircle naming no ring, a radius ≤ 0 or a non-finite value, and for annotation layers asked in R12 (which
 * has no plot flag to keep them from plotting).
 */
export function writeDxf(input: WriterInput): string {
  const drawing = collectDrawing(input);
  const layers = declaredLayers(input);
  if (input.dxfVersion === 'r12') {
    if (layers.some((l) => !l.plot)) {
      throw new RhoformError('E_INTERNAL', 'expected no annotation layers in an R12 DXF (R12 has no per-layer plot flag), found some');
    }
    return writeDxfR12(drawing, input.units, layers);
  }
  if (input.dxfVersion !== undefined && input.dxfVersion !== 'r2000') {
    throw new RhoformError('E_INTERNAL', `expected DXF version r12 or r2000, found ${JSON.stringify(String(input.dxfVersion))}`);
  }
  return writeR2000(drawing, input.units, layers);
}

function writeR2000(drawing: Drawing, units: WriterInput['units'], layers: readonly DxfLayer[]): string {
  // Handles are numbered in writing order, so $HANDSEED (the next free handle) is known before writing.
  let count = 0;
  let vertices = 0;
  for (const it of drawing.items) {
    count += it.kind === 'marker' ? 2 : 1;
    if (it.kind === 'ring') vertices += it.ring.xy.length >> 1;
  }
  const [ex0, ey0, ex1, ey1] = drawing.extents;
  const [lx0, ly0, lx1, ly1] = drawing.limits;
  const fixed = new DxfTags();
  const header = {
    insunits: units === 'in' ? 1 : 4,
    measurement: units === 'in' ? 0 : 1,
    extmin: [ex0, ey0],
    extmax: [ex1, ey1],
    limmin: [lx0, ly0],
    limmax: [lx1, ly1],
    handseed: FIRST_ENTITY_HANDLE + count,
    layers,
  } as const;
  headerSection(fixed, header);
  classesSection(fixed);
  tablesSection(fixed, header);
  blocksSection(fixed);
  fixed.tag(0, 'SECTION').tag(2, 'ENTITIES');

  const out = new TextSink(8192 + 200 * count + 40 * vertices);
  out.str(fixed.text());
  let handle = FIRST_ENTITY_HANDLE;
  const owner = hex(H.modelSpace);
  /** Starts an entity: type, handle, owner, layer and subclass; leaves the cursor after the subclass value. */
  const start = (type: string, layer: string, subclass: string): void => {
    out.str(`  0${EOL}${type}${EOL}  5${EOL}${hex(handle++)}${EOL}330${EOL}${owner}${EOL}100${EOL}AcDbEntity`);
    out.str(`${EOL}  8${EOL}${layer}${EOL}100${EOL}${subclass}`);
  };
  const xy = (x: number, y: number): void => {
    out.str(X).num(x, DXF_DECIMALS).str(Y).num(y, DXF_DECIMALS);
  };
  for (const it of drawing.items) {
    if (it.kind === 'ring') {
      const { xy: p, bulge } = it.ring;
      const n = p.length >> 1;
      start('LWPOLYLINE', it.layer, 'AcDbPolyline');
      out.str(`${EOL} 90${EOL}${n}${EOL} 70${EOL}1`);
      for (let i = 0; i < n; i++) {
        xy(p[2 * i], p[2 * i + 1]);
        if (bulge && bulge[i] !== 0) out.str(`${EOL} 42${EOL}`).num(bulge[i], DXF_DECIMALS);
      }
      out.str(EOL);
    } else if (it.kind === 'circle') {
      start('CIRCLE', it.layer, 'AcDbCircle');
      xy(it.x, it.y);
      out.str(`${Z0}${EOL} 40${EOL}`).num(it.r, DXF_DECIMALS).str(EOL);
    } else {
      start('POINT', it.layer, 'AcDbPoint');
      xy(it.x, it.y);
      out.str(`${Z0}${EOL}`);
      // The label sits up and right of its point by half a text height.
      start('TEXT', it.layer, 'AcDbText');
      xy(it.x + it.height / 2, it.y + it.height / 2);
      out.str(`${Z0}${EOL} 40${EOL}`).num(it.height, DXF_DECIMALS);
      out.str(`${EOL}  1${EOL}${dxfText(it.text)}${EOL}100${EOL}AcDbText${EOL}`);
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

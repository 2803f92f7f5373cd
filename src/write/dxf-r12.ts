/**
 * The R12 (AC1009) form of a DXF drawing, for machine software that reads nothing newer (DESIGN §14).
 *
 * Structure per the AutoCAD Release 12 DXF Reference (from memory, checked by re-reading with dxf-parser and
 * auditing with ezdxf): HEADER ($ACADVER AC1009, $INSBASE, $EXTMIN/$EXTMAX, $LIMMIN/$LIMMAX, and $INSUNITS /
 * $MEASUREMENT, which R12 readers skip and later readers use), TABLES (LTYPE CONTINUOUS, LAYER, STYLE STANDARD),
 * an empty BLOCKS section, ENTITIES, EOF. No handles ($HANDLING off), no CLASSES or OBJECTS.
 * - a ring is a closed POLYLINE (66 = 1 vertices follow, 70 = 1 closed) with one VERTEX per point (42 = bulge of
 *   the edge that starts there) and a SEQEND; a true circle is a CIRCLE; the same layers as R2000;
 * - R12 has no per-layer plot flag, so annotation layers are never written in R12 (src/write/dxf.ts refuses).
 * Numbers, line ends and determinism as the R2000 writer.
 */
import { RhoformError } from '../errors.js';
import type { DxfLayer } from './dxf-sections.js';
import { DXF_DECIMALS, DxfTags, EOL } from './dxf-tags.js';
import type { Drawing } from './drawing.js';
import { TextSink } from './text-sink.js';
import type { WriterInput } from './types.js';

/** R12 layer records; names as given (R12 allows lower case in a DXF file; readers fold case). */
function tables(t: DxfTags, layers: readonly DxfLayer[]): void {
  t.tag(0, 'SECTION').tag(2, 'TABLES');
  t.tag(0, 'TABLE').tag(2, 'LTYPE').int(70, 1);
  t.tag(0, 'LTYPE').tag(2, 'CONTINUOUS').int(70, 0).tag(3, 'Solid line').int(72, 65).int(73, 0).tag(40, 0);
  t.tag(0, 'ENDTAB');
  t.tag(0, 'TABLE').tag(2, 'LAYER').int(70, layers.length);
  for (const l of layers) t.tag(0, 'LAYER').tag(2, l.name).int(70, 0).int(62, l.color).tag(6, 'CONTINUOUS');
  t.tag(0, 'ENDTAB');
  t.tag(0, 'TABLE').tag(2, 'STYLE').int(70, 1);
  t.tag(0, 'STYLE').tag(2, 'STANDARD').int(70, 0).tag(40, 0).tag(41, 1).tag(50, 0).int(71, 0).tag(42, 2.5).tag(3, 'txt').tag(4, '');
  t.tag(0, 'ENDTAB');
  t.tag(0, 'ENDSEC');
}

/** Writes a collected drawing (output units) as R12 DXF text (CRLF). Part layers only. */
export function writeDxfR12(drawing: Drawing, units: WriterInput['units'], layers: readonly DxfLayer[]): string {
  const t = new DxfTags();
  const [ex0, ey0, ex1, ey1] = drawing.extents;
  const [lx0, ly0, lx1, ly1] = drawing.limits;
  t.tag(0, 'SECTION').tag(2, 'HEADER');
  t.tag(9, '$ACADVER').tag(1, 'AC1009');
  t.tag(9, '$INSBASE').point(10, 0, 0);
  t.tag(9, '$EXTMIN').point(10, ex0, ey0);
  t.tag(9, '$EXTMAX').point(10, ex1, ey1);
  t.tag(9, '$LIMMIN').tag(10, lx0).tag(20, ly0);
  t.tag(9, '$LIMMAX').tag(10, lx1).tag(20, ly1);
  t.tag(9, '$INSUNITS').int(70, units === 'in' ? 1 : 4);
  t.tag(9, '$MEASUREMENT').int(70, units === 'in' ? 0 : 1);
  t.tag(0, 'ENDSEC');
  tables(t, layers);
  t.tag(0, 'SECTION').tag(2, 'BLOCKS').tag(0, 'ENDSEC');
  t.tag(0, 'SECTION').tag(2, 'ENTITIES');
  let vertices = 0;
  for (const it of drawing.items) if (it.kind === 'ring') vertices += it.ring.xy.length >> 1;
  const out = new TextSink(4096 + 120 * drawing.items.length + 60 * vertices);
  out.str(t.text());
  const xy = (x: number, y: number): void => {
    out.str(`${EOL} 10${EOL}`).num(x, DXF_DECIMALS).str(`${EOL} 20${EOL}`).num(y, DXF_DECIMALS).str(`${EOL} 30${EOL}0`);
  };
  for (const it of drawing.items) {
    if (it.kind === 'ring') {
      const { xy: p, bulge } = it.ring;
      const n = p.length >> 1;
      out.str(`  0${EOL}POLYLINE${EOL}  8${EOL}${it.layer}${EOL} 66${EOL}1`);
      xy(0, 0);
      out.str(`${EOL} 70${EOL}1${EOL}`);
      for (let i = 0; i < n; i++) {
        out.str(`  0${EOL}VERTEX${EOL}  8${EOL}${it.layer}`);
        xy(p[2 * i], p[2 * i + 1]);
        if (bulge && bulge[i] !== 0) out.str(`${EOL} 42${EOL}`).num(bulge[i], DXF_DECIMALS);
        out.str(EOL);
      }
      out.str(`  0${EOL}SEQEND${EOL}  8${EOL}${it.layer}${EOL}`);
    } else if (it.kind === 'circle') {
      out.str(`  0${EOL}CIRCLE${EOL}  8${EOL}${it.layer}`);
      xy(it.x, it.y);
      out.str(`${EOL} 40${EOL}`).num(it.r, DXF_DECIMALS).str(EOL);
    } else {
      throw new RhoformError('E_INTERNAL', 'expected no markers in an R12 DXF, found one');
    }
  }
  out.str(`  0${EOL}ENDSEC${EOL}  0${EOL}EOF${EOL}`);
  return out.text();
}

/**
 * The fixed parts of an R2000 (AC1015) DXF file: HEADER, CLASSES, TABLES, BLOCKS and OBJECTS.
 *
 * Structure per the DXF Reference (Autodesk, AutoCAD DXF, 2015–2026 editions) and docs/references.md §7.1:
 * R13+ files need HEADER with $ACADVER and $HANDSEED, CLASSES (may be empty), the nine symbol tables with
 * their standard records, BLOCKS with *Model_Space and *Paper_Space, ENTITIES and OBJECTS with the root
 * dictionary holding ACAD_GROUP. Every object carries its handle (5; 105 for DIMSTYLE) and owner (330).
 * Handles are fixed numbers, so the same drawing always gives the same bytes.
 */
import { DxfTags, hex } from './dxf-tags.js';

/**
 * Our layers, their ACI colours (7 white/black, 5 blue, 3 green, 1 red, 6 magenta) and whether they plot
 * (LAYER group 290: 0 = not plotted). The part's layers plot; the annotation layers never do, so a program
 * that plots or cuts what plots leaves them out.
 */
export const DXF_LAYERS = [
  { name: '0', color: 7, plot: true },
  { name: 'outline', color: 7, plot: true },
  { name: 'hole', color: 5, plot: true },
  { name: 'passive', color: 3, plot: false },
  { name: 'finding', color: 1, plot: false },
  { name: 'repair', color: 6, plot: false },
] as const;
export type DxfLayer = (typeof DXF_LAYERS)[number];

/** Fixed handles of the tables, blocks and objects; entities get handles from FIRST_ENTITY_HANDLE upward. */
export const H = {
  vportTable: 0x1,
  vportActive: 0x2,
  ltypeTable: 0x3,
  ltypeByBlock: 0x4,
  ltypeByLayer: 0x5,
  ltypeContinuous: 0x6,
  layerTable: 0x7,
  /** Layers take DXF_LAYERS.length handles from here. */
  layerFirst: 0x8,
  styleTable: 0x10,
  styleStandard: 0x11,
  viewTable: 0x12,
  ucsTable: 0x13,
  appidTable: 0x14,
  appidAcad: 0x15,
  dimstyleTable: 0x16,
  dimstyleStandard: 0x17,
  blockRecordTable: 0x18,
  modelSpace: 0x19,
  paperSpace: 0x1a,
  modelBlock: 0x1b,
  modelEndblk: 0x1c,
  paperBlock: 0x1d,
  paperEndblk: 0x1e,
  rootDict: 0x1f,
  groupDict: 0x20,
  layoutDict: 0x21,
  modelLayout: 0x22,
  paperLayout: 0x23,
} as const;
export const FIRST_ENTITY_HANDLE = 0x30;

/** Drawing-wide values of the header and the active viewport, in output units. */
export interface DxfHeaderValues {
  /** 4 = millimetres, 1 = inches ($INSUNITS, docs/references.md §7.2). */
  insunits: 1 | 4;
  /** 1 = metric, 0 = English ($MEASUREMENT, docs/references.md §7.2). */
  measurement: 0 | 1;
  extmin: readonly [number, number];
  extmax: readonly [number, number];
  /** $LIMMIN/$LIMMAX: the domain corners. */
  limmin: readonly [number, number];
  limmax: readonly [number, number];
  /** First handle not used in the file ($HANDSEED). */
  handseed: number;
  /** The layers declared in the LAYER table, '0' first. */
  layers: readonly DxfLayer[];
}

/** HEADER section. */
export function headerSection(t: DxfTags, v: DxfHeaderValues): void {
  t.tag(0, 'SECTION').tag(2, 'HEADER');
  t.tag(9, '$ACADVER').tag(1, 'AC1015');
  t.tag(9, '$DWGCODEPAGE').tag(3, 'ANSI_1252');
  t.tag(9, '$INSBASE').point(10, 0, 0);
  t.tag(9, '$EXTMIN').point(10, v.extmin[0], v.extmin[1]);
  t.tag(9, '$EXTMAX').point(10, v.extmax[0], v.extmax[1]);
  t.tag(9, '$LIMMIN').tag(10, v.limmin[0]).tag(20, v.limmin[1]);
  t.tag(9, '$LIMMAX').tag(10, v.limmax[0]).tag(20, v.limmax[1]);
  t.tag(9, '$HANDSEED').tag(5, hex(v.handseed));
  t.tag(9, '$INSUNITS').int(70, v.insunits);
  t.tag(9, '$MEASUREMENT').int(70, v.measurement);
  t.tag(0, 'ENDSEC');
}

/** CLASSES section (empty: we use no application-defined classes). */
export function classesSection(t: DxfTags): void {
  t.tag(0, 'SECTION').tag(2, 'CLASSES').tag(0, 'ENDSEC');
}

function tableStart(t: DxfTags, name: string, handle: number, count: number): void {
  t.tag(0, 'TABLE').tag(2, name).tag(5, hex(handle)).tag(330, '0').tag(100, 'AcDbSymbolTable').int(70, count);
}

function recordStart(t: DxfTags, type: string, handle: number, owner: number, subclass: string): void {
  t.tag(0, type).tag(5, hex(handle)).tag(330, hex(owner));
  t.tag(100, 'AcDbSymbolTableRecord').tag(100, subclass);
}

/** TABLES section; the active viewport shows the drawing's extents. */
export function tablesSection(t: DxfTags, v: DxfHeaderValues): void {
  t.tag(0, 'SECTION').tag(2, 'TABLES');

  const w = v.extmax[0] - v.extmin[0];
  const h = v.extmax[1] - v.extmin[1];
  tableStart(t, 'VPORT', H.vportTable, 1);
  recordStart(t, 'VPORT', H.vportActive, H.vportTable, 'AcDbViewportTableRecord');
  t.tag(2, '*Active').int(70, 0);
  t.tag(10, 0).tag(20, 0).tag(11, 1).tag(21, 1);
  t.tag(12, v.extmin[0] + w / 2).tag(22, v.extmin[1] + h / 2);
  t.tag(40, Math.max(h, 1e-6) * 1.1).tag(41, h > 0 && w > 0 ? w / h : 1);
  t.tag(0, 'ENDTAB');

  tableStart(t, 'LTYPE', H.ltypeTable, 3);
  const ltypes: [number, string, string][] = [
    [H.ltypeByBlock, 'ByBlock', ''],
    [H.ltypeByLayer, 'ByLayer', ''],
    [H.ltypeContinuous, 'Continuous', 'Solid line'],
  ];
  for (const [handle, name, description] of ltypes) {
    recordStart(t, 'LTYPE', handle, H.ltypeTable, 'AcDbLinetypeTableRecord');
    t.tag(2, name).int(70, 0).tag(3, description).int(72, 65).int(73, 0).tag(40, 0);
  }
  t.tag(0, 'ENDTAB');

  tableStart(t, 'LAYER', H.layerTable, v.layers.length);
  for (const layer of v.layers) {
    // each layer keeps its handle from DXF_LAYERS, so a layer's handle is the same in every file
    recordStart(t, 'LAYER', H.layerFirst + DXF_LAYERS.indexOf(layer), H.layerTable, 'AcDbLayerTableRecord');
    t.tag(2, layer.name).int(70, 0).int(62, layer.color).tag(6, 'Continuous');
    if (!layer.plot) t.int(290, 0);
    t.int(370, -3);
  }
  t.tag(0, 'ENDTAB');

  tableStart(t, 'STYLE', H.styleTable, 1);
  recordStart(t, 'STYLE', H.styleStandard, H.styleTable, 'AcDbTextStyleTableRecord');
  t.tag(2, 'Standard').int(70, 0).tag(40, 0).tag(41, 1).tag(50, 0).int(71, 0).tag(42, 2.5).tag(3, 'txt').tag(4, '');
  t.tag(0, 'ENDTAB');

  tableStart(t, 'VIEW', H.viewTable, 0);
  t.tag(0, 'ENDTAB');
  tableStart(t, 'UCS', H.ucsTable, 0);
  t.tag(0, 'ENDTAB');

  tableStart(t, 'APPID', H.appidTable, 1);
  recordStart(t, 'APPID', H.appidAcad, H.appidTable, 'AcDbRegAppTableRecord');
  t.tag(2, 'ACAD').int(70, 0);
  t.tag(0, 'ENDTAB');

  tableStart(t, 'DIMSTYLE', H.dimstyleTable, 1);
  t.tag(100, 'AcDbDimStyleTable');
  t.tag(0, 'DIMSTYLE').tag(105, hex(H.dimstyleStandard)).tag(330, hex(H.dimstyleTable));
  t.tag(100, 'AcDbSymbolTableRecord').tag(100, 'AcDbDimStyleTableRecord');
  t.tag(2, 'Standard').int(70, 0);
  t.tag(0, 'ENDTAB');

  tableStart(t, 'BLOCK_RECORD', H.blockRecordTable, 2);
  recordStart(t, 'BLOCK_RECORD', H.modelSpace, H.blockRecordTable, 'AcDbBlockTableRecord');
  t.tag(2, '*Model_Space');
  recordStart(t, 'BLOCK_RECORD', H.paperSpace, H.blockRecordTable, 'AcDbBlockTableRecord');
  t.tag(2, '*Paper_Space');
  t.tag(0, 'ENDTAB');

  t.tag(0, 'ENDSEC');
}

function block(t: DxfTags, name: string, begin: number, end: number, owner: number, paper: boolean): void {
  t.tag(0, 'BLOCK').tag(5, hex(begin)).tag(330, hex(owner)).tag(100, 'AcDbEntity');
  if (paper) t.int(67, 1);
  t.tag(8, '0').tag(100, 'AcDbBlockBegin').tag(2, name).int(70, 0).point(10, 0, 0).tag(3, name).tag(1, '');
  t.tag(0, 'ENDBLK').tag(5, hex(end)).tag(330, hex(owner)).tag(100, 'AcDbEntity');
  if (paper) t.int(67, 1);
  t.tag(8, '0').tag(100, 'AcDbBlockEnd');
}

/** BLOCKS section: the two layout blocks, empty (model-space entities live in ENTITIES). */
export function blocksSection(t: DxfTags): void {
  t.tag(0, 'SECTION').tag(2, 'BLOCKS');
  block(t, '*Model_Space', H.modelBlock, H.modelEndblk, H.modelSpace, false);
  block(t, '*Paper_Space', H.paperBlock, H.paperEndblk, H.paperSpace, true);
  t.tag(0, 'ENDSEC');
}

/** OBJECTS section: the root dictionary with an empty ACAD_GROUP dictionary. */
export function objectsSection(t: DxfTags): void {
  t.tag(0, 'SECTION').tag(2, 'OBJECTS');
  t.tag(0, 'DICTIONARY').tag(5, hex(H.rootDict)).tag(330, '0').tag(100, 'AcDbDictionary').int(281, 1);
  t.tag(3, 'ACAD_GROUP').tag(350, hex(H.groupDict));
  t.tag(0, 'DICTIONARY').tag(5, hex(H.groupDict)).tag(330, hex(H.rootDict)).tag(100, 'AcDbDictionary').int(281, 1);
  t.tag(0, 'ENDSEC');
}

/**
 * Input of the geometry writers (DXF, SVG).
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid (docs/conventions.md).
 * The writers convert to the output units themselves; the SVG writer does the only y-down flip of the tool.
 */
import type { RingBulges } from '../geom/bulge.js';
import type { RingCircle } from '../geom/circle.js';
import type { Domain, PolygonSet, Ring } from '../types.js';

export type { RingCircle } from '../geom/circle.js';
export type { RingBulges } from '../geom/bulge.js';

/**
 * Annotation layers a caller may add beside the part (passive-region references, findings, where repairs
 * acted). In DXF they are declared not to plot (LAYER group 290 = 0); rhoform's CLI writes them to a separate
 * `<name>.notes.dxf` and into the SVG only under `--annotations` (docs/output-formats.md).
 */
export type ExtraLayer = 'passive' | 'finding' | 'repair';

/** DXF version written: AutoCAD R12 (AC1009) or R2000 (AC1015, the default). */
export type DxfVersion = 'r12' | 'r2000';

/** A circle in mm, y up: centre (x, y), radius r > 0. */
export interface WriterCircle {
  readonly x: number;
  readonly y: number;
  readonly r: number;
}

/** A labelled point in mm, y up (a finding or a repair site). */
export interface WriterMarker {
  readonly x: number;
  readonly y: number;
  /** The text drawn beside the point (DXF TEXT; SVG text). Keep it short: a finding number. */
  readonly label: string;
  /** Longer words for the point (DXF: appended to the label; SVG: the tooltip `<title>`); optional. */
  readonly note?: string;
}

/** Extra geometry drawn on one named layer. */
export interface WriterExtra {
  readonly layer: ExtraLayer;
  /** Closed rings (implicitly closed, any orientation), mm, y up. */
  readonly rings?: readonly Ring[];
  /** True circles, mm, y up. */
  readonly circles?: readonly WriterCircle[];
  /** Labelled points, mm, y up. */
  readonly markers?: readonly WriterMarker[];
}

export interface WriterInput {
  /** The part in mm, y up; outer rings counter-clockwise, holes clockwise; rings implicitly closed. */
  polygons: PolygonSet;
  /** The domain rectangle in mm (y up); sets the drawing extents and the SVG page. */
  domain: Domain;
  /** Output units: coordinates are divided by 25.4 for 'in'. */
  units: 'mm' | 'in';
  /** Rings of the part written as true circles (at most one entry per ring). */
  ringCircles?: readonly RingCircle[];
  /** Arcs of the rings (bulges per edge); absent = every edge straight. */
  arcs?: RingBulges;
  /** Optional annotation layers; each entry drawn as closed rings, circles or labelled points on the named layer. */
  extras?: readonly WriterExtra[];
  /** DXF version (DXF writer only); default 'r2000'. Annotation layers are written only in R2000 (R12 has no plot flag). */
  dxfVersion?: DxfVersion;
  /**
   * Optional pre-rendered SVG markup (for example a `<g>` holding the density image) embedded verbatim under
   * the part. It must already be in the SVG frame: output units, x as in the model, y' = maxY − y.
   * Ignored by the DXF writer.
   */
  svgUnderlay?: string;
}

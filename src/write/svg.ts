/**
 * SVG writer: PolygonSet (mm, y up) → a standalone SVG 1.1 document whose page is the domain, one user unit one
 * millimetre (or inch) on paper.
 *
 * - The tool's only y-down conversion: y' = maxY − y (then ÷ 25.4 for inches).
 * - The part is one `<path>` with `fill-rule="evenodd"`, one sub-path per ring, so holes cut whatever their
 *   winding (SVG 1.1 §11.3; docs/references.md §7.4). A ring in `ringCircles` is two half-circle arcs in the
 *   same path (SVG 1.1 §8.3.8 'A'), sweep flag 0 for outer rings and 1 for holes; a bulged edge (`arcs`) is
 *   an `A` command, large-arc flag |θ| > π.
 * - Rings are written as the file holds them (src/geom/clean-ring.ts): rounded, no repeated point, no segment
 *   shorter than 1 µm (or one unit of the last decimal).
 * - Groups bottom to top: `underlay`, the part, then `passive`, `repair`, `finding` as separate
 *   `<g class="annotation">`; a label that would leave the page turns to the other side of its marker.
 * - Numbers: at most 3 decimals in mm, 4 in inches, no exponent, no "-0"; deterministic.
 */
import { bulgeRadius } from '../geom/bulge.js';
import { cleanRing, MIN_SEGMENT_MM } from '../geom/clean-ring.js';
import type { Ring } from '../types.js';
import { formatNumber } from './number.js';
import { ringCircleLookup } from './ring-circles.js';
import { checkDomain, checkRadius, unitDivisor } from './rings.js';
import { TextSink } from './text-sink.js';
import type { ExtraLayer, RingCircle, WriterExtra, WriterInput } from './types.js';
import { escapeXml } from './xml.js';
import { hypot } from '../geom/portable-math.js';

/** Layer colours (the same hues as the DXF layers where they have one). */
const COLORS: Readonly<Record<ExtraLayer | 'part' | 'partStroke', string>> = {
  part: '#9db4c8',
  partStroke: '#1f3a52',
  passive: '#2ca02c',
  repair: '#b5179e',
  finding: '#d62728',
};
/** Stroke widths in mm on paper. */
const PART_STROKE_MM = 0.1;
const EXTRA_STROKE_MM = 0.2;
/** Marker circle radius as a share of the larger domain side. */
const MARKER_SHARE = 0.015;
/**
 * Width of one label character as a share of the font size: the labels are digits and capitals (a finding
 * number, R<k>), whose advance widths in Helvetica/Arial are 0.556 em (digits) to 0.722 em (R) (Adobe's
 * Helvetica font metrics, from memory).
 */
const CHAR_WIDTH_SHARE = 0.75;

/**
 * Number formatting and path output in the SVG frame (output units, y down). `fx`/`fy` are the only place
 * where model coordinates (mm, y up) become SVG coordinates.
 */
class SvgFrame {
  /** Shortest written segment, output units: 1 µm, or one unit of the last decimal if that is larger. */
  readonly minSegment: number;
  constructor(
    readonly out: TextSink,
    readonly div: number,
    readonly maxY: number,
    readonly decimals: number,
  ) {
    this.minSegment = Math.max(MIN_SEGMENT_MM / div, 10 ** -decimals);
  }

  /** Model x (mm) → SVG x (output units). */
  fx(x: number): number {
    return x / this.div;
  }
  /** Model y (mm, y up) → SVG y (output units, y down): the tool's only flip, y' = maxY − y. */
  fy(y: number): number {
    return (this.maxY - y) / this.div;
  }

  /** A plain number in output units. */
  num(v: number): string {
    return formatNumber(v, this.decimals);
  }
  /** A length given in mm, in output units. */
  len(mm: number): string {
    return formatNumber(mm / this.div, this.decimals);
  }
  x(x: number): string {
    return formatNumber(this.fx(x), this.decimals);
  }
  y(y: number): string {
    return formatNumber(this.fy(y), this.decimals);
  }

  /**
   * Writes `M x y L x y x y … Z` sub-paths (space-separated) for every ring that cleans to ≥ 3 points; an edge
   * with a non-zero bulge (`bulges[k][i]`, model frame) is an `A` command.
   */
  rings(rings: readonly Ring[], first: boolean, bulges?: readonly (readonly number[] | null | undefined)[]): boolean {
    const { out, decimals } = this;
    // clean in the SVG frame: x / div and (maxY − y) / div are rounded together with the written decimals
    rings.forEach((ring, k) => {
      // cleaned in the SVG frame, so each written number is rounded once
      const flipped = ring.map(([x, y]) => [x, this.maxY - y] as const);
      const c = cleanRing(flipped, this.div, decimals, this.minSegment, bulges?.[k] ?? null);
      if (!c) return;
      const { xy, bulge } = c;
      const n = xy.length >> 1;
      out.str(first ? 'M' : ' M');
      first = false;
      out.num(xy[0], decimals).str(' ').num(xy[1], decimals);
      let line = false;
      for (let i = 0; i < n; i++) {
        const j = (i + 1) % n;
        const b = bulge ? bulge[i] : 0;
        if (b === 0) {
          if (j === 0) break; // the closing edge is the Z
          out.str(line ? ' ' : 'L');
          line = true;
          out.num(xy[2 * j], decimals).str(' ').num(xy[2 * j + 1], decimals);
        } else {
          line = false;
          const chord = hypot(xy[2 * j] - xy[2 * i], xy[2 * j + 1] - xy[2 * i + 1]);
          const r = formatNumber(bulgeRadius(chord, b), decimals);
          out.str(`A${r} ${r} 0 ${Math.abs(b) > 1 ? 1 : 0} ${b > 0 ? 0 : 1} `);
          out.num(xy[2 * j], decimals).str(' ').num(xy[2 * j + 1], decimals);
        }
      }
      out.str(' Z');
    });
    return first;
  }

  /**
   * Writes a circle (mm, y up) as a sub-path of two half-circle arcs from (cx + r, cy) through (cx − r, cy)
   * and back; `hole` picks the sweep that keeps the model's clockwise orientation. Returns false (no longer
   * the first sub-path).
   */
  circle(c: RingCircle, hole: boolean, first: boolean): boolean {
    const { out, decimals } = this;
    // The endpoints are the rounded centre ± the rounded radius, so the written radius is exactly half the
    // written chord. Rounded separately, a radius longer than half the chord by ε would put each arc's centre
    // √(2rε) off the diameter (SVG 1.1 F.6.5) — 0.1 mm for r = 5 mm at 3 decimals.
    const rr = Number(formatNumber(c.r / this.div, decimals));
    const cx = Number(formatNumber(this.fx(c.x), decimals));
    const r = formatNumber(rr, decimals);
    const y = formatNumber(this.fy(c.y), decimals);
    const right = formatNumber(cx + rr, decimals);
    const left = formatNumber(cx - rr, decimals);
    // Model counter-clockwise is screen counter-clockwise, the negative-angle direction of the y-down frame.
    const arc = `A ${r} ${r} 0 1 ${hole ? 1 : 0} `;
    out.str(first ? 'M' : ' M').str(`${right} ${y} ${arc}${left} ${y} ${arc}${right} ${y} Z`);
    return false;
  }
}

/**
 * Writes the part and the optional extra layers as an SVG document (LF line ends). Rings of fewer than 3
 * points are skipped. Throws RhoformError `E_INTERNAL` for a RingCircle naming no ring, a radius ≤ 0 or a
 * non-finite value.
 */
export function writeSvg(input: WriterInput): string {
  const [minX, minY, maxX, maxY] = checkDomain(input.domain);
  const div = unitDivisor(input.units);
  const unit = input.units;
  const circleOf = ringCircleLookup(input.polygons, input.ringCircles);
  let outers = 0;
  let holes = 0;
  let circles = 0;
  let vertices = 0;
  input.polygons.polygons.forEach((polygon, i) => {
    for (let k = 0; k <= polygon.holes.length; k++) {
      const circle = circleOf(i, k) !== undefined;
      const n = circle ? 0 : (k === 0 ? polygon.outer : polygon.holes[k - 1]).length >= 3 ? (k === 0 ? polygon.outer : polygon.holes[k - 1]).length : 0;
      if (circle) circles++;
      if (circle || n > 0) {
        if (k === 0) outers++;
        else holes++;
      }
      vertices += n;
    }
  });
  const out = new TextSink(8192 + 20 * vertices + 120 * circles);
  const f = new SvgFrame(out, div, maxY, unit === 'in' ? 4 : 3);
  const width = f.num((maxX - minX) / div);
  const height = f.num((maxY - minY) / div);
  out.str('<?xml version="1.0" encoding="UTF-8"?>\n');
  out.str(`<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${width}${unit}" height="${height}${unit}" `);
  out.str(`viewBox="${f.x(minX)} 0 ${width} ${height}">\n`);
  out.str('<title>rhoform part outline</title>\n');
  const desc =
    `${outers} outer ring(s), ${holes} hole(s)${circles > 0 ? `, ${circles} of them true circles` : ''}; ` +
    `units ${unit}; domain ${width} × ${height} ${unit}. ` +
    'Model frame y up; drawn with y = maxY − y.';
  out.str(`<desc>${escapeXml(desc)}</desc>\n`);
  if (input.svgUnderlay !== undefined && input.svgUnderlay !== '') {
    out.str(`<g id="underlay">${input.svgUnderlay}</g>\n`);
  }
  out.str(`<path id="part" fill="${COLORS.part}" fill-rule="evenodd" stroke="${COLORS.partStroke}" `);
  out.str(`stroke-width="${f.len(PART_STROKE_MM)}" stroke-linejoin="round" d="`);
  let first = true;
  input.polygons.polygons.forEach((polygon, i) => {
    for (let k = 0; k <= polygon.holes.length; k++) {
      const c = circleOf(i, k);
      if (c !== undefined) first = f.circle(c, k > 0, first);
      else first = f.rings([k === 0 ? polygon.outer : polygon.holes[k - 1]], first, [input.arcs?.[i]?.[k]]);
    }
  });
  out.str('"/>\n');

  const markerR = (Math.max(maxX - minX, maxY - minY) * MARKER_SHARE) / div;
  const page = { left: minX / div, width: (maxX - minX) / div, height: (maxY - minY) / div };
  for (const layer of ['passive', 'repair', 'finding'] as const) {
    const entries = (input.extras ?? []).filter((e) => e.layer === layer);
    const drawn = entries.some(
      (e) => (e.rings ?? []).some((r) => r.length >= 3) || (e.circles?.length ?? 0) + (e.markers?.length ?? 0) > 0,
    );
    if (!drawn) continue;
    out.str(`<g id="${layer}" class="annotation" fill="none" stroke="${COLORS[layer]}" stroke-width="${f.len(EXTRA_STROKE_MM)}">\n`);
    layerBody(entries, f, markerR, COLORS[layer], page);
    out.str('</g>\n');
  }
  out.str('</svg>\n');
  return out.text();
}

/** Rings as one unfilled path, circles as `<circle>`, markers as a circle and its label kept on the page. */
function layerBody(
  entries: readonly WriterExtra[],
  f: SvgFrame,
  markerR: number,
  color: string,
  page: { left: number; width: number; height: number },
): void {
  const out = f.out;
  if (entries.some((e) => (e.rings ?? []).some((r) => r.length >= 3))) {
    out.str('<path d="');
    let first = true;
    for (const e of entries) first = f.rings(e.rings ?? [], first);
    out.str('"/>\n');
  }
  for (const e of entries) {
    for (const c of e.circles ?? []) {
      out.str(`<circle cx="${f.x(c.x)}" cy="${f.y(c.y)}" r="${f.len(checkRadius(c.r))}"/>\n`);
    }
  }
  const r = f.num(markerR);
  const sizeValue = markerR * 1.4;
  const size = f.num(sizeValue);
  for (const e of entries) {
    for (const m of e.markers ?? []) {
      const label = escapeXml(m.label);
      const title = m.note ? `${label} ${escapeXml(m.note)}` : label;
      const cx = f.x(m.x);
      const cy = f.y(m.y);
      // Up and right of the marker by default; turned left / down where the label would leave the page.
      const width = CHAR_WIDTH_SHARE * sizeValue * m.label.length;
      const right = f.fx(m.x) + markerR + width <= page.left + page.width;
      const up = f.fy(m.y) - markerR - sizeValue >= 0;
      const dx = right ? r : `-${r}`;
      const dy = up ? `-${r}` : f.num(markerR + sizeValue);
      out.str(`<g class="marker"><title>${title}</title><circle cx="${cx}" cy="${cy}" r="${r}"/>`);
      out.str(`<text x="${cx}" y="${cy}" dx="${dx}" dy="${dy}"${right ? '' : ' text-anchor="end"'} font-family="sans-serif" font-size="${size}" `);
      out.str(`fill="${color}" stroke="none">${label}</text></g>\n`);
    }
  }
}

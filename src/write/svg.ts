/**
 * SVG writer: PolygonSet (mm, y up) → a standalone SVG 1.1 document with a physical page size.
 *
 * - The page is the domain: `width`/`height` in the output unit (`mm` or `in`) and a `viewBox` in the same
 *   unit, so one user unit is one millimetre (or inch) on paper.
 * - This is the only y-down conversion of the tool: y' = maxY − y (then divided by 25.4 for inches);
 *   x stays as in the model. The viewBox is `minX 0 width height`.
 * - The part is one `<path>` with `fill-rule="evenodd"`: every outer ring and hole is a sub-path `M … Z`, so
 *   holes cut whatever their winding (SVG 1.1 §11.3 'fill-rule'; SOURCES.md §7.4).
 * - Optional groups, bottom to top: `underlay` (caller markup), the part, `passive`, `repair`, `finding`
 *   (numbered circle markers).
 * - Numbers: at most 3 decimals in mm, 4 in inches (1 µm / 2.5 µm), no exponent, no "-0"; deterministic.
 */
import { formatNumber } from './number.js';
import { checkDomain, checkRadius, ringLength, unitDivisor } from './rings.js';
import type { ExtraLayer, WriterExtra, WriterInput } from './types.js';
import type { Ring } from '../types.js';
import { escapeXml } from './xml.js';

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
 * Writes the part and the optional extra layers as an SVG document (LF line ends).
 *
 * Input: mm, y up, origin at the lower-left corner of the grid; outer rings counter-clockwise, holes
 * clockwise, rings implicitly closed (a repeated closing point is dropped; rings of fewer than 3 points are
 * skipped). Output: viewBox in `input.units`, y down (y' = maxY − y). Pure and deterministic.
 */
export function writeSvg(input: WriterInput): string {
  const [minX, minY, maxX, maxY] = checkDomain(input.domain);
  const div = unitDivisor(input.units);
  const decimals = input.units === 'in' ? 4 : 3;
  const unit = input.units;
  const num = (v: number): string => formatNumber(v, decimals);
  const fx = (x: number): string => formatNumber(x / div, decimals);
  const fy = (y: number): string => formatNumber((maxY - y) / div, decimals);
  const len = (mm: number): string => formatNumber(mm / div, decimals);

  const pathData = (rings: readonly Ring[], parts: string[]): void => {
    for (const ring of rings) {
      const n = ringLength(ring);
      if (n === 0) continue;
      parts.push(`M${fx(ring[0][0])} ${fy(ring[0][1])}L${fx(ring[1][0])} ${fy(ring[1][1])}`);
      for (let i = 2; i < n; i++) parts.push(`${fx(ring[i][0])} ${fy(ring[i][1])}`);
      parts.push('Z');
    }
  };

  let outers = 0;
  let holes = 0;
  const d: string[] = [];
  for (const polygon of input.polygons.polygons) {
    if (ringLength(polygon.outer) > 0) outers++;
    pathData([polygon.outer], d);
    for (const hole of polygon.holes) if (ringLength(hole) > 0) holes++;
    pathData(polygon.holes, d);
  }

  const width = (maxX - minX) / div;
  const height = (maxY - minY) / div;
  const out: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${num(width)}${unit}" height="${num(height)}${unit}" ` +
      `viewBox="${fx(minX)} 0 ${num(width)} ${num(height)}">`,
    '<title>rhoform part outline</title>',
    `<desc>${escapeXml(
      `${outers} outer ring(s), ${holes} hole(s); units ${unit}; domain ${num(width)} × ${num(height)} ${unit}. ` +
        'Model frame y up; drawn with y = maxY − y.',
    )}</desc>`,
  ];
  if (input.svgUnderlay !== undefined && input.svgUnderlay !== '') {
    out.push(`<g id="underlay">${input.svgUnderlay}</g>`);
  }
  out.push(
    `<path id="part" fill="${COLORS.part}" fill-rule="evenodd" stroke="${COLORS.partStroke}" ` +
      `stroke-width="${len(PART_STROKE_MM)}" stroke-linejoin="round" d="${d.join(' ')}"/>`,
  );

  const markerR = (Math.max(maxX - minX, maxY - minY) * MARKER_SHARE) / div;
  for (const layer of ['passive', 'repair', 'finding'] as const) {
    const entries = (input.extras ?? []).filter((e) => e.layer === layer);
    if (entries.length === 0) continue;
    out.push(
      `<g id="${layer}" fill="none" stroke="${COLORS[layer]}" stroke-width="${len(EXTRA_STROKE_MM)}">`,
    );
    layerBody(entries, out, { fx, fy, len, num, markerR, color: COLORS[layer], pathData });
    out.push('</g>');
  }
  out.push('</svg>', '');
  return out.join('\n');
}

interface LayerTools {
  fx(x: number): string;
  fy(y: number): string;
  len(mm: number): string;
  num(v: number): string;
  markerR: number;
  color: string;
  pathData(rings: readonly Ring[], parts: string[]): void;
}

/** Rings as one unfilled path, circles as `<circle>`, markers as a circle and its label. */
function layerBody(entries: readonly WriterExtra[], out: string[], t: LayerTools): void {
  const d: string[] = [];
  for (const e of entries) t.pathData(e.rings ?? [], d);
  if (d.length > 0) out.push(`<path d="${d.join(' ')}"/>`);
  for (const e of entries) {
    for (const c of e.circles ?? []) out.push(`<circle cx="${t.fx(c.x)}" cy="${t.fy(c.y)}" r="${t.len(checkRadius(c.r))}"/>`);
  }
  const r = t.num(t.markerR);
  const size = t.num(t.markerR * 1.4);
  for (const e of entries) {
    for (const m of e.markers ?? []) {
      const label = escapeXml(m.label);
      out.push(
        `<g class="marker"><title>${label}</title><circle cx="${t.fx(m.x)}" cy="${t.fy(m.y)}" r="${r}"/>` +
          `<text x="${t.fx(m.x)}" y="${t.fy(m.y)}" dx="${r}" dy="-${r}" font-family="sans-serif" ` +
          `font-size="${size}" fill="${t.color}" stroke="none">${label}</text></g>`,
      );
    }
  }
}

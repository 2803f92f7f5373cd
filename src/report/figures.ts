/**
 * The figures of the HTML report, each optional: the density field with the outline and numbered findings,
 * the local-thickness map with its legend, and the volume-vs-level curve. Pure: data in, HTML text out.
 *
 * Frame: mm, y up, origin lower-left (report frame); figures flip y once (svg-figures.ts).
 */
import type { ThicknessMap } from '../morph/types.js';
import type { DensityGrid, PolygonSet, Report } from '../types.js';
import { levelCurveSvg, thicknessLegendSvg } from './chart.js';
import { escapeHtml } from './escape.js';
import type { NumberedFinding } from './findings.js';
import { fmt } from './number.js';
import { dataUrl, encodePng, pngDataUrl } from './png.js';
import { densityRaster, thicknessMax, thicknessRaster } from './raster.js';
import {
  domainRect,
  findingMarkers,
  outlinePathElement,
  placedImage,
  planFrame,
  planViewBox,
  scaleBar,
  type PlanFrame,
} from './svg-figures.js';

/** Picture data the pipeline hands to the HTML report; every field is optional. */
export interface HtmlPictures {
  /** The prepared density grid (values 0..1, NaN allowed), mm, y up; rows j count up from the bottom. */
  readonly grid?: DensityGrid;
  /** The final outline (mm, y up; outer CCW, holes CW). */
  readonly polygons?: PolygonSet;
  /** Domain [minX, minY, maxX, maxY] mm. */
  readonly domain?: readonly [number, number, number, number];
  /** Local thickness of the solid (mm, NaN on void) — from the morphology engine. */
  readonly thickness?: ThicknessMap;
  /** Share of cells with value ≥ level, for levels 0..1 (the volume-vs-level curve). */
  readonly curve?: { readonly levels: readonly number[]; readonly fractions: readonly number[] };
  /** Older form: the final outline as a standalone SVG document, shown as an image when `polygons` is absent. */
  readonly outlineSvg?: string;
}

/** Largest raster side of the pictures, px. */
export const MAX_PICTURE_SIDE = 1200;

/** The domain of the report frame: the pictures' domain, else the grid's cells, else from the report input. */
export function pictureDomain(r: Report, p: HtmlPictures): [number, number, number, number] {
  if (p.domain) return [p.domain[0], p.domain[1], p.domain[2], p.domain[3]];
  const nodes = p.grid ? p.grid.placement === 'nodes' : r.settings.values === 'nodes';
  const nx = p.grid ? p.grid.nx : r.input.nx;
  const ny = p.grid ? p.grid.ny : r.input.ny;
  const [hx, hy] = p.grid ? p.grid.cellSize : r.input.cellSize;
  const [ox, oy] = p.grid ? p.grid.origin : [0, 0];
  return [ox, oy, ox + (nodes ? nx - 1 : nx) * hx, oy + (nodes ? ny - 1 : ny) * hy];
}

function planSvg(f: PlanFrame, label: string, body: string): string {
  return `<svg class="plan" viewBox="${planViewBox(f)}" role="img" aria-label="${escapeHtml(label)}">${body}</svg>`;
}

function figure(n: number, id: string, svg: string, caption: string, extra = ''): string {
  return `<figure id="${id}">${svg}${extra}<figcaption><strong>Figure ${n}.</strong> ${caption}</figcaption></figure>`;
}

/**
 * The figures' HTML (a hidden SVG holding the shared outline path and domain clip, then each figure whose
 * data is present, numbered in order) for report `r`, pictures `p` and the numbered findings.
 */
export function figuresHtml(r: Report, p: HtmlPictures, findings: readonly NumberedFinding[]): string {
  const domain = pictureDomain(r, p);
  let f: PlanFrame | null = null;
  try {
    f = planFrame(domain);
  } catch {
    f = null; // an empty domain has no plan figures
  }
  const out: string[] = [];
  let n = 0;
  const size = `${fmt(domain[2] - domain[0])} × ${fmt(domain[3] - domain[1])} mm`;
  const hasOutline = f !== null && p.polygons !== undefined && p.polygons.polygons.length > 0;
  if (f) {
    const defs = [`<clipPath id="rf-domain"><rect x="0" y="0" width="${f.w}" height="${f.h}"/></clipPath>`];
    if (hasOutline && p.polygons) defs.push(outlinePathElement(p.polygons, f, 'rf-outline'));
    out.push(`<svg class="defs" width="0" height="0" aria-hidden="true"><defs>${defs.join('')}</defs></svg>`);
  }
  const outlineUse = hasOutline ? '<use href="#rf-outline"/>' : '';
  if (f && p.grid) {
    const ras = densityRaster(p.grid, MAX_PICTURE_SIDE);
    const img = placedImage(f, pngDataUrl(encodePng(ras.image)), ras.extent, 'input density');
    const k = Math.round(p.grid.nx / ras.image.width) || 1;
    const body = `<g clip-path="url(#rf-domain)">${img}</g>${domainRect(f)}<g class="ol-density">${outlineUse}</g>${findingMarkers(findings, f)}${scaleBar(f)}`;
    const px = `${ras.image.width} × ${ras.image.height} px${k > 1 ? `, each pixel the mean of up to ${k} × ${k} samples` : ''}`;
    const marks =
      findings.length > 0
        ? ` Numbered rings mark the findings (red: failed check, amber: warning); the numbers are those of the findings table.`
        : ' No located findings.';
    out.push(
      figure(
        ++n,
        'fig-density',
        planSvg(f, 'input density with the final outline and findings', body),
        `Input density over the ${escapeHtml(size)} domain (grey: density 1 dark, 0 white; ${escapeHtml(px)})` +
          `${hasOutline ? ' with the final outline in blue (material tinted)' : ''}.${marks}`,
      ),
    );
  } else if (p.outlineSvg) {
    const url = dataUrl('image/svg+xml', new TextEncoder().encode(p.outlineSvg));
    out.push(
      figure(++n, 'fig-outline', `<img alt="final outline" src="${url}">`, `Final outline over the ${escapeHtml(size)} domain (material filled, holes cut).`),
    );
  }
  if (f && p.thickness && p.thickness.nx > 0 && p.thickness.ny > 0) {
    const limitSetting = r.settings.minMember;
    const limit = typeof limitSetting === 'number' && limitSetting > 0 ? limitSetting : null;
    const scale = { max: thicknessMax(p.thickness), limit };
    const ras = thicknessRaster(p.thickness, scale, MAX_PICTURE_SIDE);
    const img = placedImage(f, pngDataUrl(encodePng(ras.image)), ras.extent, 'local thickness');
    const member = findings.filter((x) => x.checkId === 'min-member-size');
    const body = `<g clip-path="url(#rf-domain)">${img}</g>${domainRect(f)}<g class="ol-thick">${outlineUse}</g>${findingMarkers(member, f)}${scaleBar(f)}`;
    out.push(
      figure(
        ++n,
        'fig-thickness',
        planSvg(f, 'local thickness of the solid', body),
        `Local thickness of the solid: the diameter of the largest disc inside the solid that covers the point` +
          `${limit !== null ? `; red where thinner than the ${escapeHtml(fmt(limit))} mm member limit` : ''}` +
          `${member.length > 0 ? '; numbered rings: min-member-size findings' : ''}.`,
        thicknessLegendSvg(scale),
      ),
    );
  }
  if (p.curve) {
    const chart = levelCurveSvg(p.curve, r.threshold);
    if (chart) {
      out.push(
        figure(
          ++n,
          'fig-curve',
          chart,
          'Share of cells whose density is at or above each level. Dashed: the chosen level (vertical) and the ' +
            'target volume fraction (horizontal); dot: cells at the chosen level; diamond: the achieved fraction of the smoothed outline.',
        ),
      );
    }
  }
  return out.join('\n');
}

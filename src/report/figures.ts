/**
 * The figures of the HTML report, each optional: the density field with the outline and numbered findings,
 * the local-thickness map with its legend, and the volume-vs-level curve. Pure: data in, HTML text out.
 *
 * Frame: mm, y up, origin lower-left (report frame); figures flip y once (svg-figures.ts).
 */
import type { StructureRecord } from '../fe/stage.js';
import type { ThicknessMap } from '../morph/types.js';
import type { DensityGrid, Domain, PolygonSet, Report } from '../types.js';
import { levelCurveSvg, thicknessLegendSvg } from './chart.js';
import { escapeHtml } from './escape.js';
import type { NumberedFinding } from '../check/findings.js';
import { fmt } from './number.js';
import { dataUrl, encodePng, encodePngLater, LATER_BYTES, pngDataUrl } from './png.js';
import { densityRaster, type PlacedRaster, thicknessMax, thicknessRaster } from './raster.js';
import { laneCount, type Pending } from '../parallel/lanes.js';
import { stressFigure } from './stress-figure.js';
import {
  domainRect,
  findingMarkers,
  fx,
  fy,
  num,
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
  readonly domain?: Domain;
  /** Local thickness of the solid (mm, NaN on void) — from the morphology engine. */
  readonly thickness?: ThicknessMap;
  /** Share of cells with value ≥ level, for levels 0..1 (the volume-vs-level curve). */
  readonly curve?: { readonly levels: readonly number[]; readonly fractions: readonly number[] };
  /** The outline before repair (mm, y up), when `--repair` ran: drawn dashed in the repair figure. */
  readonly beforeRepair?: PolygonSet;
  /** The regions the repairs changed (added or removed material, mm, y up), tinted in the repair figure. */
  readonly repaired?: PolygonSet;
  /** The structural re-check (`--loads`): the stress figure of the final geometry. */
  readonly structure?: StructureRecord;
  /** Older form: the final outline as a standalone SVG document, shown as an image when `polygons` is absent. */
  readonly outlineSvg?: string;
}

/** Largest raster side of the pictures, px. */
export const MAX_PICTURE_SIDE = 1200;

/** Density pictures started early (startDensityPicture), by grid. */
const early = new WeakMap<DensityGrid, { readonly raster: PlacedRaster; readonly png: Pending<Uint8Array> }>();

/**
 * Starts encoding the density picture of a large `grid` on another lane, when there is one, so that it is ready
 * when the HTML report is formatted (the same bytes as encoding it then); otherwise does nothing.
 */
export function startDensityPicture(grid: DensityGrid): void {
  if (laneCount(grid.values.length, LATER_BYTES) < 2 || early.has(grid)) return;
  const raster = densityRaster(grid, MAX_PICTURE_SIDE);
  early.set(grid, { raster, png: encodePngLater(raster.image) });
}

function densityPicture(grid: DensityGrid): { readonly raster: PlacedRaster; readonly png: Pending<Uint8Array> } {
  const e = early.get(grid);
  if (e) return e;
  const raster = densityRaster(grid, MAX_PICTURE_SIDE);
  return { raster, png: encodePngLater(raster.image) };
}

/** The domain of the report frame: the pictures' domain, else the grid's cells, else from the report input. */
export function pictureDomain(r: Report, p: HtmlPictures): Domain {
  if (p.domain) return [p.domain[0], p.domain[1], p.domain[2], p.domain[3]];
  const nodes = p.grid ? p.grid.placement === 'nodes' : r.settings.values === 'nodes';
  const nx = p.grid ? p.grid.nx : r.input.nx;
  const ny = p.grid ? p.grid.ny : r.input.ny;
  const [hx, hy] = p.grid ? p.grid.cellSize : r.input.cellSize;
  const [ox, oy] = p.grid ? p.grid.origin : [0, 0];
  return [ox, oy, ox + (nodes ? nx - 1 : nx) * hx, oy + (nodes ? ny - 1 : ny) * hy];
}

/** Small labelled squares where the repairs acted: R<k> for the k-th repair of the report (its table row). */
function repairMarkers(r: Report, f: PlanFrame): string {
  const parts: string[] = [];
  const half = 0.35 * f.font;
  r.repairs.forEach((rep, k) => {
    for (const L of rep.locations) {
      const x = fx(f, L.x);
      const y = fy(f, L.y);
      const title = `R${k + 1} ${rep.id} at x ${fmt(L.x)} y ${fmt(L.y)} mm (before: ${fmt(L.measured)})`;
      parts.push(
        `<a href="#repair-${k + 1}"><g class="rp-site" data-r="${k + 1}"><title>${escapeHtml(title)}</title>` +
          `<rect x="${num(f, x - half)}" y="${num(f, y - half)}" width="${num(f, 2 * half)}" height="${num(f, 2 * half)}"/>` +
          `<text x="${num(f, x + 1.2 * half)}" y="${num(f, y - 1.2 * half)}" font-size="${num(f, 0.8 * f.font)}">R${k + 1}</text></g></a>`,
      );
    }
  });
  return `<g class="repairs">${parts.join('')}</g>`;
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
  // the density picture is encoded on another lane, when there is one, while this thread does the rest
  const started = f && p.grid ? densityPicture(p.grid) : null;
  const density = started ? started.raster : null;
  const densityPng = started ? started.png : null;
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
  const densityAt = out.length;
  let densityFigure: (() => string) | null = null;
  if (f && p.grid && density && densityPng) {
    const plan = f;
    const ras = density;
    const k = Math.round(p.grid.nx / ras.image.width) || 1;
    const rest = `${domainRect(f)}<g class="ol-density">${outlineUse}</g>${findingMarkers(findings, f)}${scaleBar(f)}`;
    const px = `${ras.image.width} × ${ras.image.height} px${k > 1 ? `, each pixel the mean of up to ${k} × ${k} samples` : ''}`;
    const marks =
      findings.length > 0
        ? ` Numbered rings mark the findings (red: failed check, amber: warning); the numbers are those of the findings table.`
        : ' No located findings.';
    const caption =
      `Input density over the ${escapeHtml(size)} domain (grey: density 1 dark, 0 white; ${escapeHtml(px)})` +
      `${hasOutline ? ' with the final outline in blue (material tinted)' : ''}.${marks}`;
    const num = ++n;
    densityFigure = () => {
      const img = placedImage(plan, pngDataUrl(densityPng.join()), ras.extent, 'input density');
      return figure(num, 'fig-density', planSvg(plan, 'input density with the final outline and findings', `<g clip-path="url(#rf-domain)">${img}</g>${rest}`), caption);
    };
    out.push(''); // filled in below, once the picture is encoded
  } else if (p.outlineSvg) {
    const url = dataUrl('image/svg+xml', new TextEncoder().encode(p.outlineSvg));
    out.push(
      figure(++n, 'fig-outline', `<img alt="final outline" src="${url}">`, `Final outline over the ${escapeHtml(size)} domain (material filled, holes cut).`),
    );
  }
  const stress = f && p.structure ? stressFigure(p.structure, f, r.settings.allowableStress ?? null, MAX_PICTURE_SIDE) : null;
  if (f && stress) out.push(figure(++n, 'fig-stress', planSvg(f, 'von Mises stress of the final geometry with supports, loads and the deformed outline', stress.body + scaleBar(f)), stress.caption, stress.legend));
  if (f && p.repaired && p.beforeRepair) {
    const changed = p.repaired.polygons.length > 0 ? `<g class="rp-changed">${outlinePathElement(p.repaired, f, 'rf-repaired')}</g>` : '';
    const before = `<g class="rp-before">${outlinePathElement(p.beforeRepair, f, 'rf-before')}</g>`;
    const sites = repairMarkers(r, f);
    const body = `${domainRect(f)}<g class="rp-after">${outlineUse}</g>${changed}${before}${sites}${scaleBar(f)}`;
    out.push(
      figure(
        ++n,
        'fig-repair',
        planSvg(f, 'the outline before and after repair', body),
        'Repair: the final outline (blue, material tinted), the outline before repair (dashed) and the material the repairs ' +
          'added or removed (green). Labels R1, R2, … mark where each repair acted, in the order of the repairs table.',
      ),
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
  if (densityFigure) out[densityAt] = densityFigure();
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

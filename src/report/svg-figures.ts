/**
 * Inline SVG pieces of the report's plan figures: the frame (viewBox in mm), the outline path, numbered
 * finding markers and a scale bar. Written for embedding in HTML: no namespace URL, `href` (not xlink).
 *
 * Frame: the report frame is mm, y up, origin lower-left. The figure frame is x' = x − minX,
 * y' = maxY − y (y flipped once, here), in mm; [minX, minY, maxX, maxY] is the domain.
 */
import type { Domain, PolygonSet, Ring } from '../types.js';
import type { NumberedFinding } from '../check/findings.js';
import { fmt } from './number.js';
import { escapeHtml } from './escape.js';

/** Geometry of one plan figure: the domain and the sizes derived from it (mm). */
export interface PlanFrame {
  readonly minX: number;
  readonly minY: number;
  readonly maxX: number;
  readonly maxY: number;
  /** Domain width and height, mm. */
  readonly w: number;
  readonly h: number;
  /** Margin around the domain, mm. */
  readonly margin: number;
  /** Label font size, mm (about 14 px on a 1000 px wide figure). */
  readonly font: number;
  /** Height of the band below the domain that holds the scale bar, mm. */
  readonly band: number;
  /** Decimal places of coordinates written into the SVG. */
  readonly decimals: number;
}

/** The figure frame of a domain [minX, minY, maxX, maxY] (mm). Throws a RangeError on an empty domain. */
export function planFrame(domain: Domain): PlanFrame {
  const [minX, minY, maxX, maxY] = domain;
  const w = maxX - minX;
  const h = maxY - minY;
  if (!(w > 0 && h > 0)) throw new RangeError(`figure domain: expected a positive size, found ${w} × ${h} mm`);
  const size = Math.max(w, h);
  const font = size / 70;
  const decimals = Math.max(0, Math.min(6, 4 - Math.floor(Math.log10(size))));
  return { minX, minY, maxX, maxY, w, h, margin: font, font, band: 2.6 * font, decimals };
}

/** A number rounded to the frame's decimals, shortest text. */
export function num(f: PlanFrame, v: number): string {
  const s = v.toFixed(f.decimals);
  return s.includes('.') ? s.replace(/\.?0+$/, '') : s;
}

/** The `viewBox` attribute value of a plan figure (domain, margin and scale-bar band). */
export function planViewBox(f: PlanFrame): string {
  return `${num(f, -f.margin)} ${num(f, -f.margin)} ${num(f, f.w + 2 * f.margin)} ${num(f, f.h + 2 * f.margin + f.band)}`;
}

/** Figure x' (mm) of a report x. */
export const fx = (f: PlanFrame, x: number): number => x - f.minX;
/** Figure y' (mm) of a report y: y' = maxY − y. */
export const fy = (f: PlanFrame, y: number): number => f.maxY - y;

/**
 * The quantum of the outline path (mm, a power of ten about a tenth of a screen pixel on a 1200 px figure):
 * the path is written in integer multiples of it, under `transform="scale(q)"`.
 */
export function pathQuantum(f: PlanFrame): number {
  return 10 ** Math.floor(Math.log10(Math.max(f.w, f.h) / 12000));
}

function ringPath(ring: Ring, f: PlanFrame, q: number, keep: number, out: string[]): void {
  const n = ring.length;
  if (n < 3) return;
  const xs: number[] = [];
  const ys: number[] = [];
  let lx = NaN;
  let ly = NaN;
  for (let i = 0; i < n; i++) {
    const X = Math.round((ring[i][0] - f.minX) / q);
    const Y = Math.round((f.maxY - ring[i][1]) / q);
    if (xs.length > 0 && Math.abs(X - lx) < keep && Math.abs(Y - ly) < keep) continue;
    xs.push(X);
    ys.push(Y);
    lx = X;
    ly = Y;
  }
  if (xs.length < 3) {
    // a ring smaller than the display tolerance: keep all its points so it still shows
    xs.length = 0;
    ys.length = 0;
    for (const [x, y] of ring) {
      xs.push(Math.round((x - f.minX) / q));
      ys.push(Math.round((f.maxY - y) / q));
    }
  }
  let s = `M${xs[0]} ${ys[0]}l`;
  for (let i = 1; i < xs.length; i++) {
    const dx = xs[i] - xs[i - 1];
    const dy = ys[i] - ys[i - 1];
    s += `${i > 1 ? ' ' : ''}${dx} ${dy}`;
  }
  out.push(`${s}z`);
}

/**
 * The `d` attribute of the whole outline as one even-odd path (every outer ring and hole a subpath), in
 * integer units of `pathQuantum(f)` and figure coordinates (y' = maxY − y). Points closer than
 * `tolerancePx` screen pixels (of a 1200 px figure) to the last kept point are dropped — drawing only;
 * the geometry files keep every vertex.
 */
export function outlinePathData(set: PolygonSet, f: PlanFrame, tolerancePx = 0.4): string {
  const q = pathQuantum(f);
  const keep = ((tolerancePx * Math.max(f.w, f.h)) / 1200 / q) | 0;
  const out: string[] = [];
  for (const p of set.polygons) {
    ringPath(p.outer, f, q, keep, out);
    for (const hole of p.holes) ringPath(hole, f, q, keep, out);
  }
  return out.join('');
}

/** `<path>` element of the outline with id `id` (for `<use href="#id">`), drawn by CSS class `outline`. */
export function outlinePathElement(set: PolygonSet, f: PlanFrame, id: string): string {
  const q = pathQuantum(f);
  return `<path id="${escapeHtml(id)}" class="outline" fill-rule="evenodd" vector-effect="non-scaling-stroke" transform="scale(${q})" d="${outlinePathData(set, f)}"/>`;
}

/** A thin rectangle around the domain (where the grid is). */
export function domainRect(f: PlanFrame): string {
  return `<rect class="domain" x="0" y="0" width="${num(f, f.w)}" height="${num(f, f.h)}"/>`;
}

/**
 * Numbered markers: a ring at each location and its number beside it, fail red / warn amber (drawn last), each a link
 * to the finding's table row (`#finding-N`). Labels carry `data-n` so tests can read the numbers back.
 */
export function findingMarkers(findings: readonly NumberedFinding[], f: PlanFrame): string {
  const r = 0.55 * f.font;
  const parts: string[] = [];
  // warnings first, failures last, so a failure is drawn on top where markers overlap (numbers unchanged)
  const order = [...findings.filter((x) => x.status === 'warn'), ...findings.filter((x) => x.status === 'fail')];
  for (const fd of order) {
    const x = fx(f, fd.location.x);
    const y = fy(f, fd.location.y);
    const title = `#${fd.n} ${fd.checkId}: ${fmt(fd.location.measured)} at x ${fmt(fd.location.x)} y ${fmt(fd.location.y)} mm`;
    parts.push(
      `<a href="#finding-${fd.n}"><g class="mk ${fd.status}" data-n="${fd.n}"><title>${escapeHtml(title)}</title>` +
        `<circle cx="${num(f, x)}" cy="${num(f, y)}" r="${num(f, r)}"/>` +
        `<text x="${num(f, x + 0.8 * r)}" y="${num(f, y - 0.8 * r)}" font-size="${num(f, f.font)}">${fd.n}</text></g></a>`,
    );
  }
  return `<g class="findings">${parts.join('')}</g>`;
}

/** The largest 1, 2 or 5 × 10^k not above `x` (x > 0). */
export function niceBelow(x: number): number {
  const p = 10 ** Math.floor(Math.log10(x));
  const m = x / p;
  return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
}

/** A scale bar in the band below the domain: about a fifth of the width, a 1-2-5 length, labelled in mm. */
export function scaleBar(f: PlanFrame): string {
  const len = niceBelow(Math.min(f.w, Math.max(f.w, f.h) / 5));
  const y = f.h + f.margin + 0.6 * f.font;
  const t = 0.3 * f.font;
  return (
    `<g class="scalebar"><path d="M0 ${num(f, y - t)}V${num(f, y + t)}M0 ${num(f, y)}H${num(f, len)}M${num(f, len)} ${num(f, y - t)}V${num(f, y + t)}"/>` +
    `<text x="${num(f, len + 0.5 * f.font)}" y="${num(f, y + 0.35 * f.font)}" font-size="${num(f, f.font)}">${fmt(len)} mm</text></g>`
  );
}

/** An `<image>` of a raster placed over its extent [minX, minY, maxX, maxY] (mm), pixels kept crisp. */
export function placedImage(f: PlanFrame, href: string, extent: readonly [number, number, number, number], label: string): string {
  const [x0, y0, x1, y1] = extent;
  return (
    `<image class="raster" href="${href}" x="${num(f, fx(f, x0))}" y="${num(f, fy(f, y1))}" width="${num(f, x1 - x0)}" ` +
    `height="${num(f, y1 - y0)}" preserveAspectRatio="none"><title>${escapeHtml(label)}</title></image>`
  );
}

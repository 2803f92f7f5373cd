/**
 * The stress figure of the HTML report (`--loads`, docs/structure.md): the final geometry coloured by von Mises
 * stress (MPa, clipped to the outline), the undeformed outline thin, the deformed outline dashed with its
 * magnification stated, supports as triangles (pointing along the fixed directions) and loads as arrows with
 * their totals, and a colour bar. Pure: the structure record and the figure frame in, SVG text out.
 *
 * Frame: mm, y up (report frame); the figure flips y once through fx/fy (svg-figures.ts).
 */
import type { FeAnalysis } from '../fe/analyse.js';
import type { StructureRecord } from '../fe/stage.js';
import { entryLabel } from '../loads/resolve.js';
import type { PolygonSet, Ring } from '../types.js';
import { ticks } from './chart.js';
import { escapeHtml } from './escape.js';
import { fmt } from './number.js';
import { encodePng, pngDataUrl } from './png.js';
import { blockFactor, blockMeans } from './raster.js';
import { fx, fy, niceBelow, num, outlinePathData, pathQuantum, placedImage, type PlanFrame } from './svg-figures.js';
import { hypot } from '../geom/portable-math.js';

/** Stress colour scale, low to high: blue, cyan, green-yellow, orange, red (a sequential "rainbow" engineers read at once). */
const STOPS: readonly (readonly [number, number, number])[] = [
  [0x2c, 0x3e, 0x9e],
  [0x1f, 0x9e, 0xc9],
  [0x8c, 0xd1, 0x4f],
  [0xfd, 0xc0, 0x2f],
  [0xf4, 0x6d, 0x24],
  [0xc6, 0x1a, 0x1a],
];

/** Colour of t ∈ [0, 1] on the stress scale. */
export function stressColor(t: number): [number, number, number] {
  const c = !(t > 0) ? 0 : t > 1 ? 1 : t;
  const f = c * (STOPS.length - 1);
  const i = Math.min(STOPS.length - 2, Math.floor(f));
  const u = f - i;
  const a = STOPS[i];
  const b = STOPS[i + 1];
  return [Math.round(a[0] + u * (b[0] - a[0])), Math.round(a[1] + u * (b[1] - a[1])), Math.round(a[2] + u * (b[2] - a[2]))];
}

const rgb = ([r, g, b]: readonly [number, number, number]): string => `rgb(${r},${g},${b})`;

/** The von Mises field as an RGBA raster, 0 … `max` MPa; elements with (almost) no material transparent. */
function stressRaster(a: FeAnalysis, x0: number, y0: number, max: number, maxSide: number) {
  const [ex, ey] = a.elements;
  const [hx, hy] = a.elementSize;
  const v = new Float64Array(ex * ey);
  for (let e = 0; e < v.length; e++) v[e] = a.fraction[e] > 0.01 ? Math.min(a.vonMises[e], max) : NaN;
  const k = blockFactor(ex, ey, maxSide);
  const { w, h, means } = blockMeans(v, ex, ey, k);
  const data = new Uint8Array(w * h * 4);
  for (let o = 0; o < means.length; o++) {
    const m = means[o];
    if (m !== m) continue;
    const [r, g, b] = stressColor(m / max);
    data[4 * o] = r;
    data[4 * o + 1] = g;
    data[4 * o + 2] = b;
    data[4 * o + 3] = 255;
  }
  const extent: [number, number, number, number] = [x0, y0 + ey * hy - h * k * hy, x0 + w * k * hx, y0 + ey * hy];
  return { image: { width: w, height: h, colorType: 6 as const, data }, extent };
}

/** Bilinear displacement (mm) of the analysis at (x, y). */
function displacementAt(a: FeAnalysis, x0: number, y0: number, x: number, y: number): [number, number] {
  const [ex, ey] = a.elements;
  const [hx, hy] = a.elementSize;
  const s = Math.min(ex, Math.max(0, (x - x0) / hx));
  const t = Math.min(ey, Math.max(0, (y - y0) / hy));
  const i = Math.min(ex - 1, Math.floor(s));
  const j = Math.min(ey - 1, Math.floor(t));
  const u = s - i;
  const w = t - j;
  const nx = ex + 1;
  const n = [j * nx + i, j * nx + i + 1, (j + 1) * nx + i, (j + 1) * nx + i + 1];
  const c = [(1 - u) * (1 - w), u * (1 - w), (1 - u) * w, u * w];
  const d = a.displacement;
  let dx = 0;
  let dy = 0;
  for (let k = 0; k < 4; k++) {
    dx += c[k] * d[2 * n[k]];
    dy += c[k] * d[2 * n[k] + 1];
  }
  return [dx, dy];
}

function deformed(set: PolygonSet, a: FeAnalysis, x0: number, y0: number, scale: number): PolygonSet {
  const move = (r: Ring): Ring =>
    r.map(([x, y]) => {
      const [dx, dy] = displacementAt(a, x0, y0, x, y);
      return [x + scale * dx, y + scale * dy] as const;
    });
  return { polygons: set.polygons.map((p) => ({ outer: move(p.outer), holes: p.holes.map(move) })) };
}

/** Every k-th of `ids` so that at most `max` remain (the first and the last kept). */
function thin(ids: readonly number[], max: number): number[] {
  if (ids.length <= max) return [...ids];
  const out: number[] = [];
  for (let q = 0; q < max; q++) out.push(ids[Math.round((q * (ids.length - 1)) / (max - 1))]);
  return out;
}

/** Supports: a triangle below/beside each (thinned) node, pointing into it, per fixed direction. */
function supportMarks(rec: StructureRecord, a: FeAnalysis, f: PlanFrame): string {
  const [ex] = a.elements;
  const [hx, hy] = a.elementSize;
  const s = 0.45 * f.font;
  const parts: string[] = [];
  rec.spec.supports.forEach((sup, k) => {
    const ids = thin(a.loadCase.supports[k].nodeIds, 24);
    const tri: string[] = [];
    for (const n of ids) {
      const x = fx(f, rec.grid.x0 + (n % (ex + 1)) * hx);
      const y = fy(f, rec.grid.y0 + Math.floor(n / (ex + 1)) * hy);
      if (sup.fix !== 'x') tri.push(`M${num(f, x)} ${num(f, y)}l${num(f, -s)} ${num(f, 1.6 * s)}h${num(f, 2 * s)}z`); // holds y: triangle below
      if (sup.fix !== 'y') tri.push(`M${num(f, x)} ${num(f, y)}l${num(f, -1.6 * s)} ${num(f, -s)}v${num(f, 2 * s)}z`); // holds x: triangle to the left
    }
    parts.push(`<path d="${tri.join('')}" fill="#2b2b2b" fill-opacity="0.85" stroke="#fff" stroke-width="0.4" vector-effect="non-scaling-stroke"><title>${escapeHtml(`${entryLabel(sup)}: fixed in ${sup.fix}`)}</title></path>`);
  });
  return `<g class="supports">${parts.join('')}</g>`;
}

/**
 * Loads: one arrow per entry, its head at the mean of its nodes, along its total force, labelled L1, L2, … with
 * the total (the caption names them). Entries acting at the same place are drawn side by side.
 */
function loadArrows(rec: StructureRecord, a: FeAnalysis, f: PlanFrame): string {
  const [ex] = a.elements;
  const [hx, hy] = a.elementSize;
  const len = 4.5 * f.font;
  const head = 0.7 * f.font;
  const parts: string[] = [];
  const at = rec.spec.loads.map((_, k) => {
    const ids = a.loadCase.loads[k].nodeIds;
    let sx = 0;
    let sy = 0;
    for (const n of ids) {
      sx += rec.grid.x0 + (n % (ex + 1)) * hx;
      sy += rec.grid.y0 + Math.floor(n / (ex + 1)) * hy;
    }
    const m = Math.max(1, ids.length);
    return [fx(f, sx / m), fy(f, sy / m)] as const;
  });
  // entries at the same place (within a font size) share it: their index in the group and its size
  const group = at.map((p, k) => at.filter((q, m) => m < k && hypot(q[0] - p[0], q[1] - p[1]) < f.font).length);
  const size = at.map((p) => at.filter((q) => hypot(q[0] - p[0], q[1] - p[1]) < f.font).length);
  rec.spec.loads.forEach((ld, k) => {
    const [Fx, Fy] = ld.force;
    const F = hypot(Fx, Fy);
    if (!(F > 0)) return;
    const dx = Fx / F;
    const dy = -Fy / F; // figure frame: y down
    const off = (group[k] - (size[k] - 1) / 2) * 1.3 * f.font;
    const tx = at[k][0] - off * dy;
    const ty = at[k][1] + off * dx;
    const bx = tx - len * dx;
    const by = ty - len * dy;
    const h1x = tx - head * dx + 0.5 * head * dy;
    const h1y = ty - head * dy - 0.5 * head * dx;
    const h2x = tx - head * dx - 0.5 * head * dy;
    const h2y = ty - head * dy + 0.5 * head * dx;
    const vertical = Math.abs(dx) < 0.5;
    const lx = vertical ? at[k][0] : bx - (dx >= 0 ? 0.3 : -0.3) * f.font;
    // labels of a group stack away from the arrows so they never overlap
    const ly = vertical ? by + (dy > 0 ? -0.35 - 1.25 * group[k] : 1.05 + 1.25 * group[k]) * f.font : by + (0.3 + 1.25 * group[k]) * f.font;
    const anchor = vertical ? 'middle' : dx >= 0 ? 'end' : 'start';
    parts.push(
      `<g><title>${escapeHtml(`L${k + 1} ${entryLabel(ld)}: [${fmt(Fx)}, ${fmt(Fy)}] N on ${a.loadCase.loads[k].nodeIds.length} nodes`)}</title>` +
        `<path d="M${num(f, bx)} ${num(f, by)}L${num(f, tx - 0.6 * head * dx)} ${num(f, ty - 0.6 * head * dy)}" stroke="#6a1b9a" stroke-width="2.2" vector-effect="non-scaling-stroke" fill="none"/>` +
        `<path d="M${num(f, tx)} ${num(f, ty)}L${num(f, h1x)} ${num(f, h1y)}L${num(f, h2x)} ${num(f, h2y)}z" fill="#6a1b9a"/>` +
        `<text x="${num(f, lx)}" y="${num(f, ly)}" font-size="${num(f, 0.8 * f.font)}" text-anchor="${anchor}" fill="#4a148c" stroke="#fff" stroke-width="3" paint-order="stroke" stroke-linejoin="round">L${k + 1} ${escapeHtml(fmt(F, 4))} N</text></g>`,
    );
  });
  return `<g class="loads">${parts.join('')}</g>`;
}

/** "L1 motor weight, left bolt [0, −600] N; …" for the caption. */
function loadNames(rec: StructureRecord): string {
  return rec.spec.loads.map((ld, k) => `L${k + 1} ${ld.name ?? ld.path} [${fmt(ld.force[0])}, ${fmt(ld.force[1])}] N`).join('; ');
}

/** Magnification of the deformed outline: the largest displacement drawn as about 4 % of the larger side, a 1-2-5 number. */
export function deformationScale(maxDisplacement: number, span: number): number {
  if (!(maxDisplacement > 0)) return 1;
  return niceBelow((0.04 * span) / maxDisplacement);
}

/** The colour bar: 0 … max MPa, the allowable marked when given. */
export function stressLegendSvg(max: number, allowable: number | null): string {
  const W = 680;
  const H = 58;
  const x0 = 12;
  const x1 = 440;
  const px = (v: number): number => x0 + (Math.min(max, Math.max(0, v)) / max) * (x1 - x0);
  const stops: string[] = [];
  for (let i = 0; i <= 10; i++) stops.push(`<stop offset="${i / 10}" stop-color="${rgb(stressColor(i / 10))}"/>`);
  const parts = [
    `<defs><linearGradient id="rf-stress-grad">${stops.join('')}</linearGradient></defs>`,
    `<rect x="${x0}" y="8" width="${x1 - x0}" height="14" fill="url(#rf-stress-grad)"/>`,
    `<rect class="frame" x="${x0}" y="8" width="${x1 - x0}" height="14"/>`,
  ];
  for (const v of ticks(max, 6)) {
    const x = Math.round(px(v) * 10) / 10;
    parts.push(`<line class="axis" x1="${x}" y1="22" x2="${x}" y2="27"/>`);
    parts.push(`<text class="tick" x="${x}" y="40" text-anchor="middle">${escapeHtml(fmt(v))}</text>`);
  }
  if (allowable !== null && allowable <= max) {
    const x = Math.round(px(allowable) * 10) / 10;
    parts.push(`<line class="limit" x1="${x}" y1="3" x2="${x}" y2="27"/>`);
    parts.push(`<text class="note" x="${x1 + 10}" y="19">line: allowable ${escapeHtml(fmt(allowable))} MPa</text>`);
  } else if (allowable !== null) {
    parts.push(`<text class="note" x="${x1 + 10}" y="19">allowable ${escapeHtml(fmt(allowable))} MPa: above the peak</text>`);
  }
  parts.push(`<text class="label" x="${x0}" y="55">von Mises stress, MPa (0 … ${escapeHtml(fmt(max))}, the peak over elements at least half full)</text>`);
  return `<svg class="legend" viewBox="0 0 ${W} ${H}" role="img" aria-label="stress colour scale in MPa">${parts.join('')}</svg>`;
}

export interface StressFigure {
  /** The figure's SVG body (inside the plan `<svg>`). */
  readonly body: string;
  readonly legend: string;
  readonly caption: string;
}

/** The stress figure of the final geometry, or null when it has no element at least half full. */
export function stressFigure(rec: StructureRecord, f: PlanFrame, allowable: number | null, maxSide: number): StressFigure | null {
  const a = rec.final.analysis;
  if (a.peakStress === null || !(a.peakStress.value > 0)) return null;
  const max = a.peakStress.value;
  const { x0, y0 } = rec.grid;
  const ras = stressRaster(a, x0, y0, max, maxSide);
  const img = placedImage(f, pngDataUrl(encodePng(ras.image)), ras.extent, 'von Mises stress, final geometry');
  const q = pathQuantum(f);
  const outline = outlinePathData(rec.polygons, f);
  const span = Math.max(f.w, f.h);
  const scale = deformationScale(a.maxDisplacement.value, span);
  const moved = outlinePathData(deformed(rec.polygons, a, x0, y0, scale), f);
  const p = a.peakStress;
  const peakMark =
    `<g><title>${escapeHtml(`peak ${fmt(p.value)} MPa at x ${fmt(p.x)} y ${fmt(p.y)} mm`)}</title>` +
    `<circle cx="${num(f, fx(f, p.x))}" cy="${num(f, fy(f, p.y))}" r="${num(f, 0.6 * f.font)}" fill="none" stroke="#000" stroke-width="1.6" vector-effect="non-scaling-stroke"/></g>`;
  const body =
    `<defs><clipPath id="rf-stress-clip"><path clip-rule="evenodd" transform="scale(${q})" d="${outline}"/></clipPath></defs>` +
    `<rect class="domain" x="0" y="0" width="${num(f, f.w)}" height="${num(f, f.h)}"/>` +
    `<g clip-path="url(#rf-stress-clip)">${img}</g>` +
    `<path fill="none" stroke="#555" stroke-width="0.8" vector-effect="non-scaling-stroke" transform="scale(${q})" d="${outline}"/>` +
    `<path fill="none" stroke="#111" stroke-width="1.3" stroke-dasharray="5 3" vector-effect="non-scaling-stroke" transform="scale(${q})" d="${moved}"><title>deformed outline, displacements × ${fmt(scale)}</title></path>` +
    supportMarks(rec, a, f) +
    loadArrows(rec, a, f) +
    peakMark;
  const caption =
    `Structural re-check of the final geometry under the load case of ${escapeHtml(rec.spec.file)}: von Mises stress ` +
    `(colour, MPa; peak ${escapeHtml(fmt(max))} MPa circled, at x ${escapeHtml(fmt(p.x))}, y ${escapeHtml(fmt(p.y))} mm), ` +
    `the outline (grey) and the deformed outline (dashed, displacements magnified × ${escapeHtml(fmt(scale))}; largest ` +
    `${escapeHtml(fmt(a.maxDisplacement.value, 3))} mm). Triangles: supports (pointing along the fixed direction). Purple arrows: loads — ${escapeHtml(loadNames(rec))}. ` +
    'A linear plane-stress analysis on the grid — not a certified analysis; peaks at clamped edges and sharp corners are singular.';
  return { body, legend: stressLegendSvg(max, allowable), caption };
}

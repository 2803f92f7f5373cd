/**
 * Small inline SVG charts of the HTML report: the volume-vs-level curve and the colour legend of the
 * thickness map. Own drawing code, no library; no namespace URL (the SVG is inline HTML).
 */
import type { Report } from '../types.js';
import { escapeHtml } from './escape.js';
import { fmt, pct } from './number.js';
import { BELOW_LIMIT_RGB, viridis, type ThicknessScale } from './raster.js';

const rgb = ([r, g, b]: readonly [number, number, number]): string => `rgb(${r},${g},${b})`;
const r1 = (v: number): string => (Math.round(v * 10) / 10).toString();

/** Tick values of [0, max]: multiples of a 1-2-5 step, about `count` of them. */
export function ticks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0];
  const raw = max / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  const step = (m > 5 ? 10 : m > 2 ? 5 : m > 1 ? 2 : 1) * p;
  const out: number[] = [];
  for (let i = 0; i * step <= max * (1 + 1e-9); i++) out.push(Number((i * step).toPrecision(12)));
  return out;
}

/**
 * The volume-vs-level curve: share of cells with value ≥ level (y, %) against the level (x, 0..1), with the
 * chosen level (vertical), the target fraction (horizontal) and the achieved polygon-area fraction marked.
 * Returns '' when the curve has fewer than two finite points.
 */
export function levelCurveSvg(
  curve: { readonly levels: readonly number[]; readonly fractions: readonly number[] },
  t: Report['threshold'],
): string {
  const pts: [number, number][] = [];
  const n = Math.min(curve.levels.length, curve.fractions.length);
  for (let i = 0; i < n; i++) {
    const x = curve.levels[i];
    const y = curve.fractions[i];
    if (Number.isFinite(x) && Number.isFinite(y)) pts.push([x, y]);
  }
  if (pts.length < 2) return '';
  pts.sort((a, b) => a[0] - b[0]);
  const W = 640;
  const H = 360;
  const L = 58;
  const R = 20;
  const T = 14;
  const B = 46;
  const px = (x: number): number => L + Math.min(1, Math.max(0, x)) * (W - L - R);
  const py = (y: number): number => H - B - Math.min(1, Math.max(0, y)) * (H - T - B);
  const parts: string[] = [];
  for (const v of ticks(1, 5)) {
    parts.push(`<line class="grid" x1="${r1(px(v))}" y1="${T}" x2="${r1(px(v))}" y2="${H - B}"/>`);
    parts.push(`<text class="tick" x="${r1(px(v))}" y="${H - B + 16}" text-anchor="middle">${fmt(v)}</text>`);
    parts.push(`<line class="grid" x1="${L}" y1="${r1(py(v))}" x2="${W - R}" y2="${r1(py(v))}"/>`);
    parts.push(`<text class="tick" x="${L - 6}" y="${r1(py(v) + 4)}" text-anchor="end">${Math.round(v * 100)} %</text>`);
  }
  parts.push(`<path class="axis" d="M${L} ${T}V${H - B}H${W - R}"/>`);
  parts.push(`<text class="label" x="${(L + W - R) / 2}" y="${H - 8}" text-anchor="middle">level (density)</text>`);
  parts.push(`<text class="label" transform="translate(14 ${(T + H - B) / 2}) rotate(-90)" text-anchor="middle">share of cells ≥ level</text>`);
  parts.push(`<polyline class="curve" points="${pts.map(([x, y]) => `${r1(px(x))},${r1(py(y))}`).join(' ')}"/>`);
  if (Number.isFinite(t.targetFraction)) {
    const y = py(t.targetFraction);
    parts.push(`<line class="target" x1="${L}" y1="${r1(y)}" x2="${W - R}" y2="${r1(y)}"/>`);
    parts.push(`<text class="note" x="${W - R - 4}" y="${r1(y - 6)}" text-anchor="end">target ${escapeHtml(pct(t.targetFraction, 2))}</text>`);
  }
  if (t.level !== null && Number.isFinite(t.level)) {
    const x = px(t.level);
    const right = t.level < 0.7;
    parts.push(`<line class="level" x1="${r1(x)}" y1="${T}" x2="${r1(x)}" y2="${H - B}"/>`);
    parts.push(
      `<text class="note" x="${r1(x + (right ? 6 : -6))}" y="${T + 14}" text-anchor="${right ? 'start' : 'end'}">level ${escapeHtml(fmt(t.level, 5))}</text>`,
    );
    if (Number.isFinite(t.pixelFraction)) {
      parts.push(`<circle class="cells" cx="${r1(x)}" cy="${r1(py(t.pixelFraction))}" r="4"><title>cells at or above the level: ${escapeHtml(pct(t.pixelFraction))}</title></circle>`);
    }
    if (Number.isFinite(t.achievedFraction)) {
      const y = py(t.achievedFraction);
      parts.push(`<path class="achieved" d="M${r1(x)} ${r1(y - 6)}l6 6-6 6-6-6z"><title>achieved (polygon area): ${escapeHtml(pct(t.achievedFraction))}</title></path>`);
      parts.push(
        `<text class="note" x="${r1(x + (right ? 10 : -10))}" y="${r1(y + 18)}" text-anchor="${right ? 'start' : 'end'}">achieved ${escapeHtml(pct(t.achievedFraction, 2))} (polygon area)</text>`,
      );
    }
  }
  return `<svg class="chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="share of cells at or above each level">${parts.join('')}</svg>`;
}

/**
 * Colour legend of the thickness picture: the viridis bar over 0 … scale.max mm with ticks, the part below
 * the member limit in the fail red and the limit marked. `gradientId` must be unique in the page.
 */
export function thicknessLegendSvg(scale: ThicknessScale, gradientId = 'rf-thick-grad'): string {
  const W = 680;
  const H = 58;
  const x0 = 12;
  const x1 = 440;
  const max = scale.max > 0 ? scale.max : 1;
  const px = (v: number): number => x0 + (Math.min(max, Math.max(0, v)) / max) * (x1 - x0);
  const stops: string[] = [];
  for (let i = 0; i <= 10; i++) stops.push(`<stop offset="${i / 10}" stop-color="${rgb(viridis(i / 10))}"/>`);
  const parts = [
    `<defs><linearGradient id="${escapeHtml(gradientId)}">${stops.join('')}</linearGradient></defs>`,
    `<rect x="${x0}" y="8" width="${x1 - x0}" height="14" fill="url(#${escapeHtml(gradientId)})"/>`,
  ];
  const lim = scale.limit;
  if (lim !== null && lim > 0) {
    const xl = px(lim);
    parts.push(`<rect x="${x0}" y="8" width="${r1(xl - x0)}" height="14" fill="${rgb(BELOW_LIMIT_RGB)}"/>`);
    parts.push(`<line class="limit" x1="${r1(xl)}" y1="3" x2="${r1(xl)}" y2="27"/>`);
    parts.push(`<text class="note" x="${x1 + 10}" y="19">red: below ${escapeHtml(fmt(lim))} mm (min member)</text>`);
  } else {
    parts.push(`<text class="note" x="${x1 + 10}" y="19">no member limit set</text>`);
  }
  parts.push(`<rect class="frame" x="${x0}" y="8" width="${x1 - x0}" height="14"/>`);
  for (const v of ticks(max, 6)) {
    parts.push(`<line class="axis" x1="${r1(px(v))}" y1="22" x2="${r1(px(v))}" y2="27"/>`);
    parts.push(`<text class="tick" x="${r1(px(v))}" y="40" text-anchor="middle">${escapeHtml(fmt(v))}</text>`);
  }
  parts.push(`<text class="label" x="${x0}" y="55">local thickness, mm (0 … ${escapeHtml(fmt(max))})</text>`);
  return `<svg class="legend" viewBox="0 0 ${W} ${H}" role="img" aria-label="thickness colour scale in mm">${parts.join('')}</svg>`;
}

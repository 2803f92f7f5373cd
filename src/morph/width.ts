/**
 * Local width of one phase from the medial samples: 2r at the points of the θ-simplified medial axis with
 * θ ≥ 120° (Foskey, Lin & Manocha 2003; docs/notes/morph.md, "Local width"). Results in mm, y up.
 */
import type { MedialPoints, Phase, WidthPlace, WidthSurvey } from './types.js';
import { clusterPixels } from './cluster.js';
import { COUNT_COS, type MedialSamples } from './medial.js';
import { type Frame, toMm } from './frame.js';
import type { RasterScratch } from './scratch.js';

/** Empty pixels tolerated inside one place. */
const PLACE_GAP = 2;

/**
 * Smallest counted width of `phase` and the connected places thinner than `below` (mm), one per place at its
 * thinnest sample, thinnest first. `resolution` is half a pixel (docs/checks/min-member-size.md). `scratch`: the
 * engine's raster-sized buffer for grouping (scratch.ts), else a new table.
 */
export function widthSurvey(frame: Frame, samples: MedialSamples, phase: Phase, below: number, scratch?: RasterScratch): WidthSurvey {
  const want = phase === 'solid' ? 1 : 0;
  const px = frame.pixel;
  const limit = below / px / 2; // radius, pixel units
  let min = Infinity;
  let at = -1;
  const chosen: number[] = [];
  for (let k = 0; k < samples.n; k++) {
    if (samples.solid[k] !== want || samples.cos[k] > COUNT_COS) continue;
    const r = samples.r[k];
    if (r < min) {
      min = r;
      at = k;
    }
    if (r < limit) chosen.push(k);
  }
  const places: WidthPlace[] = [];
  if (chosen.length > 0) {
    const ii = new Int32Array(chosen.length), jj = new Int32Array(chosen.length);
    chosen.forEach((k, m) => {
      ii[m] = Math.min(frame.nx - 1, Math.max(0, Math.round(samples.x[k])));
      jj[m] = Math.min(frame.ny - 1, Math.max(0, Math.round(samples.y[k])));
    });
    const group = (owner?: Int32Array) => clusterPixels(ii, jj, frame.nx, frame.ny, PLACE_GAP, owner);
    const { label, count } = scratch ? scratch.use((_, owner) => group(owner)) : group();
    const bestOf = new Int32Array(count).fill(-1);
    chosen.forEach((k, m) => {
      const c = label[m];
      if (bestOf[c] < 0 || samples.r[k] < samples.r[bestOf[c]]) bestOf[c] = k;
    });
    for (const k of bestOf) {
      const p = toMm(frame, samples.x[k], samples.y[k]);
      places.push({ x: p.x, y: p.y, width: 2 * samples.r[k] * px });
    }
    places.sort((a, b) => a.width - b.width);
  }
  return {
    min: at < 0 ? null : 2 * min * px,
    minAt: at < 0 ? null : toMm(frame, samples.x[at], samples.y[at]),
    places,
    resolution: 0.5 * px,
  };
}

/**
 * The counted samples of `phase` (θ ≥ 120°) whose local width 2r is below `below` mm, in mm (frame of the
 * results above). These are the samples widthSurvey groups into places; raster order.
 */
export function medialPoints(frame: Frame, samples: MedialSamples, phase: Phase, below: number): MedialPoints {
  const want = phase === 'solid' ? 1 : 0;
  const px = frame.pixel;
  const limit = below / px / 2;
  let count = 0;
  for (let k = 0; k < samples.n; k++) if (samples.solid[k] === want && samples.cos[k] <= COUNT_COS && samples.r[k] < limit) count++;
  const x = new Float64Array(count), y = new Float64Array(count), radius = new Float64Array(count);
  let m = 0;
  for (let k = 0; k < samples.n; k++) {
    if (samples.solid[k] !== want || samples.cos[k] > COUNT_COS || !(samples.r[k] < limit)) continue;
    x[m] = frame.x0 + (samples.x[k] + 0.5) * px;
    y[m] = frame.y0 + (samples.y[k] + 0.5) * px;
    radius[m] = samples.r[k] * px;
    m++;
  }
  return { count, x, y, radius };
}

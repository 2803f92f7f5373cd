/**
 * Rasters for the pictures of the HTML report: the density field as grey levels and the local-thickness map
 * as colours, both downsampled by block averaging and turned into PNG row order (row 0 at the top).
 *
 * Frame: millimetres, y up, origin at the lower-left corner of the grid. Input rows j count UP from the
 * bottom; output row 0 is the top row, so the flip happens here, once.
 */
import type { ThicknessMap } from '../morph/types.js';
import type { DensityGrid } from '../types.js';
import type { RasterImage } from './png.js';

/** A raster and the rectangle it covers, mm [minX, minY, maxX, maxY] (may reach past the domain; clip it). */
export interface PlacedRaster {
  readonly image: RasterImage;
  readonly extent: readonly [number, number, number, number];
}

/** Grey level of a density: 255 − 200·clamp(v, 0, 1), so void is white and density 1 a dark grey (55). */
export function densityGrey(v: number): number {
  const c = v < 0 ? 0 : v > 1 ? 1 : v;
  return Math.round(255 - 200 * c);
}

/**
 * Block-average factor so that a `nx`×`ny` raster fits `maxSide` pixels along either side (1 = no
 * downsampling). Integer, so every output pixel averages whole input samples.
 */
export function blockFactor(nx: number, ny: number, maxSide: number): number {
  if (!(maxSide >= 1)) throw new RangeError(`maxSide: expected ≥ 1, found ${maxSide}`);
  return Math.max(1, Math.ceil(Math.max(nx, ny) / maxSide));
}

/**
 * Averages `values` (nx × ny, values[j*nx+i], j up) over k×k blocks, ignoring NaN; returns the block means
 * (NaN where a block has no finite sample) in PNG order (row 0 = top) and the output size. The last block
 * of a row or column may be partial: it averages the samples it has.
 */
export function blockMeans(
  values: ArrayLike<number>,
  nx: number,
  ny: number,
  k: number,
): { readonly w: number; readonly h: number; readonly means: Float64Array } {
  const w = Math.ceil(nx / k);
  const h = Math.ceil(ny / k);
  const sum = new Float64Array(w * h);
  const cnt = new Uint32Array(w * h);
  for (let j = 0; j < ny; j++) {
    const row = (h - 1 - Math.floor(j / k)) * w; // flip: input row j up → output row from the top
    const base = j * nx;
    for (let i = 0; i < nx; i++) {
      const v = values[base + i];
      if (v === v) {
        const o = row + ((i / k) | 0);
        sum[o] += v;
        cnt[o]++;
      }
    }
  }
  // the sums become the means in place
  for (let o = 0; o < sum.length; o++) sum[o] = cnt[o] > 0 ? sum[o] / cnt[o] : NaN;
  return { w, h, means: sum };
}

/**
 * The density grid as a grey PNG raster (densityGrey; NaN blocks transparent, then colour type 4 grey+alpha),
 * at most `maxSide` pixels along the longer side. Cell samples cover their cell; nodal samples cover a cell
 * centred on the node, so the extent of a nodal grid reaches half a cell past the domain.
 */
export function densityRaster(grid: DensityGrid, maxSide = 1200): PlacedRaster {
  const { nx, ny } = grid;
  const [hx, hy] = grid.cellSize;
  const k = blockFactor(nx, ny, maxSide);
  const { w, h, means } = blockMeans(grid.values, nx, ny, k);
  let anyNaN = false;
  for (let o = 0; o < means.length && !anyNaN; o++) anyNaN = means[o] !== means[o];
  const spp = anyNaN ? 2 : 1;
  const data = new Uint8Array(w * h * spp);
  for (let o = 0; o < means.length; o++) {
    const m = means[o];
    if (anyNaN) {
      data[2 * o] = m === m ? densityGrey(m) : 255;
      data[2 * o + 1] = m === m ? 255 : 0;
    } else data[o] = densityGrey(m);
  }
  const half = grid.placement === 'nodes' ? 0.5 : 0;
  const x0 = grid.origin[0] - half * hx;
  const y1 = grid.origin[1] - half * hy + ny * hy; // top edge of the sampled rows
  const ext: [number, number, number, number] = [x0, y1 - h * k * hy, x0 + w * k * hx, y1];
  return { image: { width: w, height: h, colorType: anyNaN ? 4 : 0, data }, extent: ext };
}

/**
 * Viridis colour map (S. van der Walt & N. Smith, matplotlib, 2015; CC0), five anchor colours from memory
 * (#440154, #3b528b, #21918c, #5ec962, #fde725), linearly interpolated. t in [0, 1] → [r, g, b].
 */
const VIRIDIS: readonly (readonly [number, number, number])[] = [
  [0x44, 0x01, 0x54],
  [0x3b, 0x52, 0x8b],
  [0x21, 0x91, 0x8c],
  [0x5e, 0xc9, 0x62],
  [0xfd, 0xe7, 0x25],
];

export function viridis(t: number): [number, number, number] {
  const c = !(t > 0) ? 0 : t > 1 ? 1 : t;
  const f = c * (VIRIDIS.length - 1);
  const i = Math.min(VIRIDIS.length - 2, Math.floor(f));
  const u = f - i;
  const a = VIRIDIS[i];
  const b = VIRIDIS[i + 1];
  return [Math.round(a[0] + u * (b[0] - a[0])), Math.round(a[1] + u * (b[1] - a[1])), Math.round(a[2] + u * (b[2] - a[2]))];
}

/** CSS colour of thickness below the member limit (the fail colour of the report). */
export const BELOW_LIMIT_RGB: readonly [number, number, number] = [0xd0, 0x1c, 0x1c];

/** Colour scale of the thickness picture: 0 … `max` mm on viridis, values below `limit` mm in BELOW_LIMIT_RGB. */
export interface ThicknessScale {
  readonly max: number;
  readonly limit: number | null;
}

/** Largest finite value of a thickness map (mm); 0 when there is none. */
export function thicknessMax(map: ThicknessMap): number {
  let m = 0;
  for (let o = 0; o < map.values.length; o++) {
    const v = map.values[o];
    if (v > m) m = v;
  }
  return m;
}

/**
 * The local-thickness map as an RGBA PNG raster: void (NaN) transparent, thickness t mm coloured
 * viridis(t / scale.max), below `scale.limit` in the fail red. Block-averaged to at most `maxSide` pixels.
 */
export function thicknessRaster(map: ThicknessMap, scale: ThicknessScale, maxSide = 1200): PlacedRaster {
  const k = blockFactor(map.nx, map.ny, maxSide);
  const { w, h, means } = blockMeans(map.values, map.nx, map.ny, k);
  const data = new Uint8Array(w * h * 4);
  const lim = scale.limit;
  const max = scale.max > 0 ? scale.max : 1;
  for (let o = 0; o < means.length; o++) {
    const m = means[o];
    if (m !== m) continue; // transparent
    const [r, g, b] = lim !== null && m < lim ? BELOW_LIMIT_RGB : viridis(m / max);
    data[4 * o] = r;
    data[4 * o + 1] = g;
    data[4 * o + 2] = b;
    data[4 * o + 3] = 255;
  }
  const [x0, y0, x1, y1] = map.domain;
  const px = (x1 - x0) / map.nx;
  const py = (y1 - y0) / map.ny;
  return {
    image: { width: w, height: h, colorType: 6, data },
    extent: [x0, y1 - h * k * py, x0 + w * k * px, y1],
  };
}

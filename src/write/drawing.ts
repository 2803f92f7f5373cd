/**
 * What a DXF file draws, collected once in output units before any text is written: the part's rings cleaned as
 * the file holds them (src/geom/clean-ring.ts), true circles, the annotation layers, and the drawing's extents
 * — so `$EXTMIN`/`$EXTMAX` are the bounds of the entities written (DESIGN §8), not the grid.
 *
 * Input frame: mm, y up; output: mm ÷ `div` (1 for mm, 25.4 for inches), y up.
 */
import { extendByArc } from '../geom/bulge.js';
import { cleanRing, MIN_SEGMENT_MM, type CleanRing } from '../geom/clean-ring.js';
import type { Ring } from '../types.js';
import { DXF_DECIMALS } from './dxf-tags.js';
import { ringCircleLookup } from './ring-circles.js';
import { checkDomain, checkRadius, unitDivisor } from './rings.js';
import type { WriterInput } from './types.js';

/** Text height of marker labels as a share of the larger domain side. */
const LABEL_HEIGHT_SHARE = 0.02;
/** Width of one character of a label as a share of its height (a generous estimate for the extents). */
const CHAR_WIDTH_SHARE = 0.7;

export type DrawingItem =
  | { readonly kind: 'ring'; readonly layer: string; readonly ring: CleanRing }
  | { readonly kind: 'circle'; readonly layer: string; readonly x: number; readonly y: number; readonly r: number }
  | { readonly kind: 'marker'; readonly layer: string; readonly x: number; readonly y: number; readonly text: string; readonly height: number };

export interface Drawing {
  /** Entities in writing order, output units. */
  readonly items: readonly DrawingItem[];
  /** Layers that hold an entity, in first-use order. */
  readonly layers: readonly string[];
  /** Bounds of every entity (output units); the domain corners for an empty drawing. */
  readonly extents: readonly [number, number, number, number];
  /** The domain rectangle in output units (`$LIMMIN`/`$LIMMAX`). */
  readonly limits: readonly [number, number, number, number];
  readonly div: number;
}

/**
 * Collects the drawing of `input`. Part rings and extra rings are cleaned at the DXF's 6 decimals with the
 * 1 µm minimum segment (MIN_SEGMENT_MM, in output units); a ring that cleans to fewer than 3 points is dropped.
 * Labels are placed up and right of their point by half a text height.
 */
export function collectDrawing(input: WriterInput): Drawing {
  const [minX, minY, maxX, maxY] = checkDomain(input.domain);
  const div = unitDivisor(input.units);
  const minSeg = MIN_SEGMENT_MM / div;
  const circleOf = ringCircleLookup(input.polygons, input.ringCircles);
  const items: DrawingItem[] = [];
  const ring = (r: Ring, layer: string, bulges?: readonly number[] | null): void => {
    const c = cleanRing(r, div, DXF_DECIMALS, minSeg, bulges ?? null);
    if (c) items.push({ kind: 'ring', layer, ring: c });
  };
  input.polygons.polygons.forEach((polygon, i) => {
    const rings = [polygon.outer, ...polygon.holes];
    rings.forEach((r, k) => {
      const layer = k === 0 ? 'outline' : 'hole';
      const c = circleOf(i, k);
      if (c !== undefined) items.push({ kind: 'circle', layer, x: c.x / div, y: c.y / div, r: c.r / div });
      else ring(r, layer, input.arcs?.[i]?.[k]);
    });
  });
  const height = (Math.max(maxX - minX, maxY - minY) * LABEL_HEIGHT_SHARE) / div;
  for (const extra of input.extras ?? []) {
    for (const r of extra.rings ?? []) ring(r, extra.layer);
    for (const c of extra.circles ?? []) items.push({ kind: 'circle', layer: extra.layer, x: c.x / div, y: c.y / div, r: checkRadius(c.r) / div });
    for (const m of extra.markers ?? []) {
      items.push({ kind: 'marker', layer: extra.layer, x: m.x / div, y: m.y / div, text: m.note ? `${m.label} ${m.note}` : m.label, height });
    }
  }
  const layers: string[] = [];
  for (const it of items) if (!layers.includes(it.layer)) layers.push(it.layer);
  const limits = [minX / div, minY / div, maxX / div, maxY / div] as const;
  return { items, layers, extents: extentsOf(items) ?? limits, limits, div };
}

/** Bounds of the items (output units), or null when there are none. */
function extentsOf(items: readonly DrawingItem[]): [number, number, number, number] | null {
  const box = [Infinity, Infinity, -Infinity, -Infinity];
  for (const it of items) {
    if (it.kind === 'circle') {
      box[0] = Math.min(box[0], it.x - it.r);
      box[1] = Math.min(box[1], it.y - it.r);
      box[2] = Math.max(box[2], it.x + it.r);
      box[3] = Math.max(box[3], it.y + it.r);
    } else if (it.kind === 'marker') {
      const h = it.height;
      box[0] = Math.min(box[0], it.x);
      box[1] = Math.min(box[1], it.y);
      box[2] = Math.max(box[2], it.x + h / 2 + CHAR_WIDTH_SHARE * h * Math.max(1, it.text.length));
      box[3] = Math.max(box[3], it.y + 1.5 * h);
    } else {
      const { xy, bulge } = it.ring;
      const n = xy.length >> 1;
      for (let i = 0; i < n; i++) {
        const j = (i + 1) % n;
        extendByArc(box, xy[2 * i], xy[2 * i + 1], xy[2 * j], xy[2 * j + 1], bulge ? bulge[i] : 0);
      }
    }
  }
  return box[0] <= box[2] ? [box[0], box[1], box[2], box[3]] : null;
}

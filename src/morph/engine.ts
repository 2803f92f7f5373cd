/**
 * The morphology engine: one raster, one feature transform, then local widths, tool corners and a thickness
 * picture on demand. Frame: mm, y up, origin at the lower-left corner of the grid; square pixels of
 * `options.pixel` mm plus a margin of open space. Methods: docs/notes/morph.md; accuracy: docs/checks/.
 */
import type { PolygonSet } from '../types.js';
import type { CornerSurvey, MedialPoints, Morphology, MorphologyOptions, Phase, ThicknessMap, WidthSurvey } from './types.js';
import { cornerSurvey, padFor } from './corners.js';
import { type MedialSamples, medialSamples } from './medial.js';
import { type NearestField, nearestField } from './nearest.js';
import { type Frame, makeFrame } from './frame.js';
import { phaseMask } from './raster.js';
import { RasterScratch } from './scratch.js';
import { type SegmentSet, segmentsOf } from './segments.js';
import { rasterLanes } from './split.js';
import { thicknessMap } from './thickness.js';
import { medialPoints, widthSurvey } from './width.js';

/** Open-space margin (pixels) of the first raster; corners() rebuilds with a wider one when the tool needs it. */
const BASE_PAD = 6;
/** Largest raster (pixels, margin included): ~25 bytes a pixel, so about 0.6 GB — a guard, not a working size. */
const MAX_RASTER = 24_000_000;

interface Stage {
  readonly frame: Frame;
  readonly set: SegmentSet;
  readonly field: NearestField;
  readonly phase: Uint8Array;
  /** Raster-sized memory the steps lend each other (scratch.ts). */
  readonly scratch: RasterScratch;
}

function stage(polygons: PolygonSet, domain: MorphologyOptions['domain'], pixel: number, pad: number): Stage {
  const frame = makeFrame(domain, pixel, pad);
  if (frame.nx * frame.ny > MAX_RASTER) {
    throw new RangeError(`buildMorphology: expected at most ${MAX_RASTER} pixels, found ${frame.nx} × ${frame.ny}`);
  }
  const set = segmentsOf(polygons, frame);
  const scratch = new RasterScratch(frame.nx * frame.ny, rasterLanes(frame.nx * frame.ny) > 1);
  const field = scratch.use((best) => nearestField(frame, set, best));
  return { frame, set, field, phase: phaseMask(frame, set), scratch };
}

/**
 * Builds the engine for one outline. `polygons`: mm, y up, outer rings CCW, holes CW (every ring segment is
 * boundary, domain-edge segments included); `options.domain` = [minX, minY, maxX, maxY] mm; `options.pixel` > 0
 * mm (see choosePixel). The feature transform runs here; medial samples on the first width()/thicknessMap().
 * Inputs are not modified.
 */
export function buildMorphology(polygons: PolygonSet, options: MorphologyOptions): Morphology {
  const { domain, pixel } = options;
  if (!(pixel > 0) || !Number.isFinite(pixel)) throw new RangeError(`buildMorphology: expected pixel > 0, found ${pixel}`);
  if (!domain.every(Number.isFinite) || !(domain[2] > domain[0]) || !(domain[3] > domain[1])) {
    throw new RangeError(`buildMorphology: expected domain [minX, minY, maxX, maxY] with max > min, found ${domain.join(', ')}`);
  }
  const base = stage(polygons, domain, pixel, BASE_PAD);
  let wide: Stage | undefined;
  let samples: MedialSamples | undefined;
  const medial = (): MedialSamples => (samples ??= medialSamples(base.frame, base.set, base.field, base.phase, base.scratch));
  return {
    pixel,
    width(phase: Phase, below: number): WidthSurvey {
      if (phase !== 'solid' && phase !== 'void') throw new RangeError(`width: expected 'solid' or 'void', found ${String(phase)}`);
      if (Number.isNaN(below)) throw new RangeError('width: expected a limit in mm, found NaN');
      return widthSurvey(base.frame, medial(), phase, below, base.scratch);
    },
    medial(phase: Phase, below: number): MedialPoints {
      if (phase !== 'solid' && phase !== 'void') throw new RangeError(`medial: expected 'solid' or 'void', found ${String(phase)}`);
      if (Number.isNaN(below)) throw new RangeError('medial: expected a limit in mm, found NaN');
      return medialPoints(base.frame, medial(), phase, below);
    },
    corners(toolRadius: number, depth: number): CornerSurvey {
      if (!(toolRadius > 0) || !Number.isFinite(toolRadius)) throw new RangeError(`corners: expected a tool radius > 0 mm, found ${toolRadius}`);
      if (!(depth >= 0)) throw new RangeError(`corners: expected a depth ≥ 0 mm, found ${depth}`);
      let st = base;
      if (padFor(toolRadius, pixel) > base.frame.pad) {
        // a margin that would more than double the raster: survey on a coarser one (docs/notes/morph.md)
        const budget = Math.min(MAX_RASTER, 2 * base.frame.nx * base.frame.ny);
        let p = pixel;
        for (;;) {
          const f = makeFrame(domain, p, padFor(toolRadius, p));
          if (f.nx * f.ny <= budget) break;
          p *= 1.1;
        }
        const need = padFor(toolRadius, p);
        if (!wide || wide.frame.pixel !== p || wide.frame.pad < need) wide = stage(polygons, domain, p, need);
        st = wide;
      }
      return cornerSurvey(st.frame, st.set, st.field, st.phase, toolRadius, depth, st.scratch);
    },
    thicknessMap(maxSide: number): ThicknessMap {
      if (!(maxSide >= 1)) throw new RangeError(`thicknessMap: expected maxSide ≥ 1, found ${maxSide}`);
      return thicknessMap(base.frame, base.set, base.field, base.phase, medial(), maxSide);
    },
  };
}

/** Process presets: generic default size limits, mm, defaults only; docs/processes.md gives each value's source. */
import { UsageError, show } from '../errors.js';

export const PROCESS_IDS = [
  'laser-cut',
  'waterjet-cut',
  'milling',
  'material-extrusion',
  'vat-photopolymerization',
  'pbf-polymer',
  'pbf-metal',
] as const;

export type ProcessId = (typeof PROCESS_IDS)[number];

/** A preset limit (mm) and its source. */
export interface PresetValue {
  readonly value: number;
  readonly source: string;
}

/** The sizes a preset sets, mm with sources; null where it sets none (the check stays off unless asked for). */
export interface ProcessLimits {
  readonly minMember: PresetValue | null;
  readonly minHole: PresetValue | null;
  readonly toolRadius: PresetValue | null;
}

const TITLES: Record<ProcessId, string> = {
  'laser-cut': 'Laser cutting of sheet',
  'waterjet-cut': 'Abrasive waterjet cutting of sheet',
  milling: 'Milling (2.5-axis, end mill)',
  'material-extrusion': 'Material extrusion (MEX)',
  'vat-photopolymerization': 'Vat photopolymerization (VPP)',
  'pbf-polymer': 'Powder bed fusion, polymer (PBF-LB/P)',
  'pbf-metal': 'Powder bed fusion, metal (PBF-LB/M)',
};

const SHEET: ReadonlySet<ProcessId> = new Set<ProcessId>(['laser-cut', 'waterjet-cut']);

/** Waterjet kerf, mm: 0.03 in (fabricator design guide). */
export const WATERJET_KERF = 0.03 * 25.4;
/** Default end-mill radius for `milling`, mm: a 3 mm end mill (common practice, no source). */
export const MILLING_TOOL_RADIUS = 1.5;

const GUIDE_LASER = 'fabricator design guides for laser cutting';
const GUIDE_AM = 'vendor design guides for additive manufacturing';
const COMMON = 'common practice, no source';

export function isProcessId(s: string): s is ProcessId {
  return (PROCESS_IDS as readonly string[]).includes(s);
}

export function needsThickness(id: ProcessId): boolean {
  return SHEET.has(id);
}

export function processTitle(id: ProcessId): string {
  return TITLES[id];
}

const pv = (value: number, source: string): PresetValue => ({ value, source });

/**
 * Default size limits (mm) of a process; sheet processes scale with `thickness` (mm), milling with `toolRadius`.
 * @throws UsageError (E_USAGE) naming `--thickness` or `--tool-radius` when needed but not a length > 0.
 */
export function processLimits(id: ProcessId, thickness: number | null, toolRadius: number | null = null): ProcessLimits {
  if (toolRadius !== null && !(toolRadius > 0 && Number.isFinite(toolRadius))) {
    throw new UsageError(`--tool-radius: expected a length > 0 mm, found ${show(toolRadius)}`);
  }
  if (SHEET.has(id)) {
    if (thickness === null || thickness === undefined) {
      throw new UsageError(`--process ${id}: expected --thickness <mm> (the sheet thickness), found none`);
    }
    if (!(thickness > 0 && Number.isFinite(thickness))) {
      throw new UsageError(`--thickness: expected a sheet thickness > 0 mm, found ${show(thickness)}`);
    }
  }
  const t = thickness ?? NaN;
  switch (id) {
    case 'laser-cut':
      return {
        minMember: pv(t, `${GUIDE_LASER}: web between cuts ≥ t (1–1.5 t preferred)`),
        minHole: pv(Math.max(t, 1), `${GUIDE_LASER}: hole Ø ≥ t, at least 1 mm`),
        toolRadius: null,
      };
    case 'waterjet-cut':
      return {
        minMember: pv(t, `web ≥ t: ${COMMON} (no thickness rule found in waterjet guides)`),
        minHole: pv(Math.max(t, WATERJET_KERF), `hole Ø ≥ t: ${COMMON}; never below the 0.76 mm kerf (fabricator design guide)`),
        toolRadius: pv(WATERJET_KERF / 2, 'half the 0.76 mm (0.03 in) kerf of a fabricator design guide: the jet rounds inner corners to it'),
      };
    case 'milling': {
      const r = toolRadius ?? MILLING_TOOL_RADIUS;
      return {
        minMember: pv(0.8, 'machining-shop design guides: walls ≥ 0.8 mm in metal (≥ 1.5 mm in plastic)'),
        minHole: pv(2 * r, toolRadius === null
          ? `2 × the tool radius (derived: the tool must fit); tool radius ${COMMON}`
          : '2 × --tool-radius (derived: the tool must fit)'),
        toolRadius: pv(MILLING_TOOL_RADIUS, `a 3 mm end mill: ${COMMON}`),
      };
    }
    case 'material-extrusion':
      return {
        minMember: pv(0.8, `${GUIDE_AM}: wall ≥ 0.8 mm (2 × 0.4 mm nozzle; 1.2–2.0 mm structural)`),
        minHole: pv(2.0, `${GUIDE_AM}: hole Ø ≥ 2.0 mm`),
        toolRadius: null,
      };
    case 'vat-photopolymerization':
      return {
        minMember: pv(0.5, `${GUIDE_AM}: wall ≥ 0.5 mm`),
        minHole: pv(0.5, `${GUIDE_AM}: hole Ø ≥ 0.5 mm`),
        toolRadius: null,
      };
    case 'pbf-polymer':
      return {
        minMember: pv(0.8, `${GUIDE_AM}: wall ≥ 0.7–0.8 mm (1.0 mm recommended)`),
        minHole: pv(1.5, `${GUIDE_AM}: hole Ø ≥ 1.0–1.5 mm`),
        toolRadius: null,
      };
    case 'pbf-metal':
      return {
        minMember: pv(0.5, `${GUIDE_AM}: wall ≥ 0.4 mm supported, 1.0 mm unsupported; 0.5 mm`),
        minHole: pv(1.0, `${GUIDE_AM}: hole Ø ≥ 0.5–1.0 mm`),
        toolRadius: null,
      };
  }
}

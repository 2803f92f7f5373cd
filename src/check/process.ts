/**
 * Process presets (`--process <id>`, `--thickness <mm>`): generic default limits for the size checks
 * (minimum member, minimum hole, tool radius) of a manufacturing process. docs/processes.md lists every value
 * with its source.
 *
 * All values are in millimetres. They are rules of thumb from fabricator and vendor design guides, which
 * disagree by up to about ±50 %, or trade practice labelled "common practice, no source": defaults only.
 * The fabricator's limits, local codes and licensed engineering practice govern, and every value is
 * overridden by `--min-member`, `--min-hole` and `--tool-radius`.
 *
 * Additive category names follow ISO/ASTM 52900 (material extrusion, vat photopolymerization, powder bed
 * fusion); no trademarked process names.
 */
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

/** One preset limit: the value (mm) and where it comes from (a short citation, or "common practice, no source"). */
export interface PresetValue {
  readonly value: number;
  readonly source: string;
}

/** The size limits a process preset sets; null where the preset sets none (the check stays off unless asked for). */
export interface ProcessLimits {
  /** Smallest allowed local width of the solid, mm (`min-member-size`). */
  readonly minMember: PresetValue | null;
  /** Smallest allowed hole or gap width, mm (`min-hole-size`). */
  readonly minHole: PresetValue | null;
  /** Radius of the cutting tool, mm (`min-inner-radius`). */
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

/** The processes that cut sheet and so need `--thickness`. */
const SHEET: ReadonlySet<ProcessId> = new Set<ProcessId>(['laser-cut', 'waterjet-cut']);

/** Waterjet kerf, mm: 0.03 in (fabricator design guide). */
export const WATERJET_KERF = 0.03 * 25.4;
/** Default end-mill radius for `milling`, mm: a 3 mm end mill (common practice, no source). */
export const MILLING_TOOL_RADIUS = 1.5;

const GUIDE_LASER = 'fabricator design guides for laser cutting';
const GUIDE_AM = 'vendor design guides for additive manufacturing';
const COMMON = 'common practice, no source';

/** Whether `s` names a process preset. */
export function isProcessId(s: string): s is ProcessId {
  return (PROCESS_IDS as readonly string[]).includes(s);
}

/** Whether the process cuts sheet and needs `--thickness`. */
export function needsThickness(id: ProcessId): boolean {
  return SHEET.has(id);
}

/** The human title of a process (ISO/ASTM 52900 category names for the additive ones). */
export function processTitle(id: ProcessId): string {
  return TITLES[id];
}

const pv = (value: number, source: string): PresetValue => ({ value, source });

/**
 * The default size limits of a process, in mm.
 *
 * `thickness` is the sheet thickness t in mm; the sheet processes (`laser-cut`, `waterjet-cut`) need it and
 * scale with it; the others ignore it. `toolRadius` (optional, mm) is the user's `--tool-radius`: limits the
 * preset derives from the tool (milling: smallest slot or hole = 2 × tool radius) then follow it.
 *
 * @throws UsageError (code E_USAGE) naming `--thickness` when a sheet process lacks a thickness or it is not
 *   a finite length > 0, and naming `--tool-radius` when that is given but not a finite length > 0.
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
        // web/bridge between cuts ≥ t (1–1.5 t preferred); hole Ø ≥ t with a 1 mm floor
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

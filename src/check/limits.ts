/** The size limits in force: `--process` fills what was not given; explicit options win (docs/processes.md). */
import type { Settings } from '../settings.js';
import { processLimits, processTitle, type PresetValue, type ProcessId } from './process.js';
import type { ResolvedLimits } from './registry.js';
import { defaultMinHoleArea } from './small-holes.js';

export interface ProcessReport {
  readonly id: string;
  readonly title: string;
  /** mm; null when the process needs none. */
  readonly thickness: number | null;
  /** The preset's own values (mm) with their sources. */
  readonly values: { readonly minMember: PresetValue | null; readonly minHole: PresetValue | null; readonly toolRadius: PresetValue | null };
}

/** `cellSize` (mm) sets the default hole-area limit when `--min-hole-area` was not given. */
export function resolveLimits(s: Settings, cellSize?: readonly [number, number]): { limits: ResolvedLimits; process: ProcessReport | null } {
  const minHoleArea = s.minHoleArea ?? (cellSize ? defaultMinHoleArea(cellSize) : null);
  if (s.process === null) return { limits: { minMember: s.minMember, minHole: s.minHole, toolRadius: s.toolRadius, minHoleArea }, process: null };
  const id = s.process as ProcessId;
  const preset = processLimits(id, s.thickness, s.toolRadius);
  return {
    limits: {
      minMember: s.minMember ?? preset.minMember?.value ?? null,
      minHole: s.minHole ?? preset.minHole?.value ?? null,
      toolRadius: s.toolRadius ?? preset.toolRadius?.value ?? null,
      minHoleArea,
    },
    process: { id, title: processTitle(id), thickness: s.thickness, values: { minMember: preset.minMember, minHole: preset.minHole, toolRadius: preset.toolRadius } },
  };
}

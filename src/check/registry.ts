/** Every check in report order with its default severity, limit source and message words (docs/checks/README.md). */
import type { Settings } from '../settings.js';
import { greyLevel } from './grey-level.js';
import type { CheckId } from './ids.js';
import { islands } from './islands.js';
import { loadPath } from './load-path.js';
import { peakStress } from './peak-stress.js';
import { stiffnessChange } from './stiffness-change.js';
import { minHoleSize } from './min-hole-size.js';
import { minInnerRadius } from './min-inner-radius.js';
import { minMemberSize } from './min-member-size.js';
import { outlineFidelity } from './outline-fidelity.js';
import type { PlannedCheck } from './run.js';
import { smallHoles } from './small-holes.js';
import type { CheckDefinition } from './types.js';
import { volumeFraction } from './volume-fraction.js';

export interface ResolvedLimits {
  readonly minMember: number | null;
  readonly minHole: number | null;
  readonly toolRadius: number | null;
  /** mm²; absent: `settings.minHoleArea` as given. */
  readonly minHoleArea?: number | null;
}

export interface PlanInputs {
  readonly tolerance: number;
  readonly limits: ResolvedLimits;
  /** With a fixed --level the volume is not enforced, so its check only warns. */
  readonly mode: 'volume' | 'level' | 'constant';
}

interface Entry {
  readonly def: CheckDefinition;
  readonly severity: (p: PlanInputs) => 'warn' | 'fail';
  readonly limit: (s: Settings, p: PlanInputs) => number | null;
  readonly label: string;
  readonly place: string;
  readonly none: string;
}

const ENTRIES: readonly Entry[] = [
  { def: volumeFraction, severity: (p) => (p.mode === 'volume' ? 'fail' : 'warn'), limit: (s) => s.volumeTolerance, label: 'relative volume error', place: 'place', none: 'no volume target' },
  { def: minMemberSize, severity: () => 'fail', limit: (_s, p) => p.limits.minMember, label: 'thinnest member', place: 'thin place', none: 'no solid' },
  { def: minHoleSize, severity: () => 'fail', limit: (_s, p) => p.limits.minHole, label: 'narrowest hole or gap', place: 'narrow place', none: 'no hole or gap' },
  { def: minInnerRadius, severity: () => 'fail', limit: (_s, p) => p.limits.toolRadius, label: 'tightest inner corner radius', place: 'tight corner', none: 'no corner tighter than the tool' },
  { def: islands, severity: () => 'warn', limit: (s) => s.minIslandArea, label: 'largest island', place: 'island', none: 'no island' },
  { def: smallHoles, severity: () => 'warn', limit: (s, p) => (p.limits.minHoleArea !== undefined ? p.limits.minHoleArea : s.minHoleArea), label: 'smallest hole area', place: 'small hole', none: 'no hole' },
  { def: outlineFidelity, severity: () => 'fail', limit: (_s, p) => p.tolerance, label: 'largest outline deviation', place: 'place', none: 'no outline' },
  { def: greyLevel, severity: () => 'warn', limit: (s) => s.greyWarn, label: 'grey level M_nd', place: 'place', none: 'no input' },
  { def: stiffnessChange, severity: () => 'warn', limit: (s) => (s.loads === null ? null : s.maxStiffnessLoss), label: 'compliance increase over the input design', place: 'place', none: 'no structural analysis' },
  { def: peakStress, severity: () => 'fail', limit: (s) => (s.loads === null ? null : s.allowableStress), label: 'peak von Mises stress', place: 'stressed region', none: 'no element at least half full' },
  { def: loadPath, severity: () => 'fail', limit: (s) => (s.loads === null ? null : 0), label: 'supports, loads or pieces cut off', place: 'cut-off place', none: 'no structural analysis' },
];

export const CHECKS: readonly CheckDefinition[] = ENTRIES.map((e) => e.def);

export function planChecks(s: Settings, p: PlanInputs): PlannedCheck[] {
  const out: PlannedCheck[] = [];
  for (const e of ENTRIES) {
    const limit = e.limit(s, p);
    if (limit === null) continue;
    const override = s.severity[e.def.id as CheckId];
    if (override === 'off') continue;
    out.push({ def: e.def, limit, severity: override ?? e.severity(p), label: e.label, place: e.place, none: e.none });
  }
  return out;
}

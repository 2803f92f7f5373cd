/** Check ids in report order; part of the public contract (report JSON, `--severity`): never rename one. */
export const CHECK_IDS = [
  'volume-fraction',
  'min-member-size',
  'min-hole-size',
  'min-inner-radius',
  'islands',
  'small-holes',
  'outline-fidelity',
  'grey-level',
  'stiffness-change',
  'peak-stress',
  'load-path',
] as const;

export type CheckId = (typeof CHECK_IDS)[number];

export function isCheckId(s: string): s is CheckId {
  return (CHECK_IDS as readonly string[]).includes(s);
}

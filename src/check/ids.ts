/**
 * The ids of every registered check, in report order (docs/checks/<id>.md documents each one).
 * Ids are part of the public contract (report JSON, `--severity <id>=…`): never rename one.
 */
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

/** Whether `s` names a registered check. */
export function isCheckId(s: string): s is CheckId {
  return (CHECK_IDS as readonly string[]).includes(s);
}

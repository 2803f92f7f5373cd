/**
 * Choosing the array to read from a file that holds several (MAT variables, VTK arrays): `--field <name>` names
 * it; without it the only usable candidate is taken. Several candidates, or none, is an error that lists what the
 * file holds, with sizes, so that the user can name one.
 */
import { RhoformError, type ErrorCode, type Where } from '../errors.js';

/** One named array of a file, as far as choosing is concerned. */
export interface Candidate {
  readonly name: string;
  /** How the file describes it, for messages: "200×100 double", "cell 1×3". */
  readonly label: string;
  /** Null when it can be read as a grid; otherwise why it is refused ("complex", "a struct"). */
  readonly refused: string | null;
  /** False for arrays that can be read when named but are not taken automatically (a 1×1 scalar). */
  readonly automatic: boolean;
  readonly where: Where;
}

export interface ChooseCodes {
  /** No such name, no candidate, or several candidates. */
  readonly field: ErrorCode;
  /** The named array exists but cannot be read as a grid. */
  readonly refused: ErrorCode;
}

function list(cands: readonly Candidate[]): string {
  if (cands.length === 0) return 'nothing';
  return cands.map((c) => `${JSON.stringify(c.name)} (${c.label}${c.refused ? `, refused: ${c.refused}` : ''})`).join(', ');
}

/**
 * The candidate to read. `what` names the kind of array in messages, without an article ("real numeric 2-D matrix").
 * @throws RhoformError with codes.field or codes.refused.
 */
export function chooseCandidate(
  cands: readonly Candidate[],
  field: string | null | undefined,
  what: string,
  codes: ChooseCodes,
  where: Where,
): Candidate {
  if (field !== null && field !== undefined) {
    const hit = cands.find((c) => c.name === field);
    if (!hit) throw new RhoformError(codes.field, `expected a ${what} named ${JSON.stringify(field)} (--field), found ${list(cands)}`, where);
    if (hit.refused) throw new RhoformError(codes.refused, `expected a ${what}, found ${JSON.stringify(hit.name)}: ${hit.label}, which is refused: ${hit.refused}`, hit.where);
    return hit;
  }
  const fit = cands.filter((c) => c.refused === null && c.automatic);
  if (fit.length === 1) return fit[0];
  if (fit.length === 0) throw new RhoformError(codes.field, `expected a ${what}, found ${list(cands)}; name one with --field if it can be read`, where);
  throw new RhoformError(codes.field, `expected one ${what}, found ${fit.length}: ${list(fit)}; choose one with --field <name>`, where);
}

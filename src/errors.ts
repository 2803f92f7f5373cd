/**
 * Typed errors with stable codes (docs/cli.md lists them). The CLI maps every RhoformError to exit code 2.
 *
 * Messages read `file:line:col: what was expected, what was found`; the position part is built from
 * the optional `where` so that library callers without a file name still get line/column or byte offsets.
 */

export type ErrorCode =
  | 'E_CSV_EMPTY'
  | 'E_CSV_RAGGED'
  | 'E_CSV_TOKEN'
  | 'E_CSV_LONG'
  | 'E_NPY_MAGIC'
  | 'E_NPY_VERSION'
  | 'E_NPY_HEADER'
  | 'E_NPY_DTYPE'
  | 'E_NPY_SHAPE'
  | 'E_NPY_TRUNCATED'
  | 'E_GRID_NONFINITE'
  | 'E_GRID_RANGE'
  | 'E_GRID_SIZE'
  | 'E_GRID_EMPTY'
  | 'E_USAGE'
  | 'E_INPUT_READ'
  | 'E_OUTPUT_EXISTS'
  | 'E_OUTPUT_IS_INPUT'
  | 'E_OUTPUT_WRITE'
  | 'E_PASSIVE_JSON'
  | 'E_PASSIVE_FORMAT'
  | 'E_LOADS_JSON'
  | 'E_LOADS_FORMAT'
  | 'E_LOADS_CASE'
  | 'E_SUMMARY_FORMAT'
  | 'E_INTERNAL';

/** A position inside an input: text line/column (1-based) or a byte offset (0-based). */
export interface Where {
  file?: string;
  line?: number;
  col?: number;
  byteOffset?: number;
}

/** Formats `file:line:col` (or `file:byte N`) for a message prefix; empty when nothing is known. */
export function formatWhere(where: Where | undefined): string {
  if (!where) return '';
  const file = where.file ?? '<input>';
  if (where.line !== undefined) {
    return where.col !== undefined ? `${file}:${where.line}:${where.col}` : `${file}:${where.line}`;
  }
  if (where.byteOffset !== undefined) return `${file}:byte ${where.byteOffset}`;
  return where.file ?? '';
}

/** Base class of every error the tool reports to a user. */
export class RhoformError extends Error {
  readonly code: ErrorCode;
  readonly where: Where | undefined;
  /** The message without the position prefix. */
  readonly detail: string;

  constructor(code: ErrorCode, detail: string, where?: Where) {
    const prefix = formatWhere(where);
    super(prefix ? `${prefix}: ${detail}` : detail);
    this.name = 'RhoformError';
    this.code = code;
    this.where = where;
    this.detail = detail;
  }

  /** The same error with the file name filled in (readers are pure and do not know it). */
  withFile(file: string): RhoformError {
    return new RhoformError(this.code, this.detail, { ...this.where, file });
  }
}

/** Bad command-line usage: unknown option, bad option value, missing argument. */
export class UsageError extends RhoformError {
  constructor(detail: string) {
    super('E_USAGE', detail);
    this.name = 'UsageError';
  }
}

/** Shows a value in a message: strings quoted and cut to 40 characters, numbers as they are. */
export function show(value: unknown): string {
  if (typeof value === 'string') {
    const cut = value.length > 40 ? `${value.slice(0, 40)}…` : value;
    return JSON.stringify(cut);
  }
  return String(value);
}

/** Typed errors with stable codes (docs/cli.md); messages read `file:line:col: expected …, found …`; the CLI exits 2. */

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
  | 'E_MAT_HEADER'
  | 'E_MAT_V73'
  | 'E_MAT_ELEMENT'
  | 'E_MAT_TRUNCATED'
  | 'E_MAT_INFLATE'
  | 'E_MAT_CLASS'
  | 'E_MAT_SHAPE'
  | 'E_MAT_FIELD'
  | 'E_VTK_HEADER'
  | 'E_VTK_DATASET'
  | 'E_VTK_TOKEN'
  | 'E_VTK_TYPE'
  | 'E_VTK_TRUNCATED'
  | 'E_VTK_SHAPE'
  | 'E_VTK_FIELD'
  | 'E_VTI_XML'
  | 'E_VTI_FORMAT'
  | 'E_VTI_DATA'
  | 'E_VTI_INFLATE'
  | 'E_VTI_TYPE'
  | 'E_VTI_SHAPE'
  | 'E_VTI_FIELD'
  | 'E_PNG_MAGIC'
  | 'E_PNG_DECODE'
  | 'E_PNG_CHANNEL'
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

/** Line/column 1-based, byte offset 0-based. */
export interface Where {
  file?: string;
  line?: number;
  col?: number;
  byteOffset?: number;
}

/** `file:line:col` or `file:byte N`; empty when nothing is known. */
export function formatWhere(where: Where | undefined): string {
  if (!where) return '';
  const file = where.file ?? '<input>';
  if (where.line !== undefined) {
    return where.col !== undefined ? `${file}:${where.line}:${where.col}` : `${file}:${where.line}`;
  }
  if (where.byteOffset !== undefined) return `${file}:byte ${where.byteOffset}`;
  return where.file ?? '';
}

export class RhoformError extends Error {
  readonly code: ErrorCode;
  readonly where: Where | undefined;
  /** Without the position prefix. */
  readonly detail: string;

  constructor(code: ErrorCode, detail: string, where?: Where) {
    // one line, always: control characters arrive escaped
    detail = escapeControls(detail);
    if (where?.file !== undefined) where = { ...where, file: escapeControls(where.file) };
    const prefix = formatWhere(where);
    super(prefix ? `${prefix}: ${detail}` : detail);
    this.name = 'RhoformError';
    this.code = code;
    this.where = where;
    this.detail = detail;
  }

  /** Readers are pure and do not know the file name. */
  withFile(file: string): RhoformError {
    return new RhoformError(this.code, this.detail, { ...this.where, file });
  }
}

export class UsageError extends RhoformError {
  constructor(detail: string) {
    super('E_USAGE', detail);
    this.name = 'UsageError';
  }
}

/** C0/C1 controls, DEL, U+2028/2029 and lone surrogates (0x9b is a one-byte CSI on some terminals). */
const CONTROL = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g;

/** Every control character as a visible escape, so a message stays one line and cannot drive a terminal; backslashes kept. */
export function escapeControls(text: string): string {
  return text.replace(CONTROL, (c) => {
    if (c === '\n') return '\\n';
    if (c === '\r') return '\\r';
    if (c === '\t') return '\\t';
    const u = c.charCodeAt(0);
    return u < 0x100 ? `\\x${u.toString(16).padStart(2, '0')}` : `\\u${u.toString(16).padStart(4, '0')}`;
  });
}

/** Double-quoted, cut to `max` characters (never inside a surrogate pair), escaped. */
export function quote(text: string, max = 40): string {
  let cut = text;
  if (text.length > max) {
    let n = max;
    const c = text.charCodeAt(n - 1);
    if (c >= 0xd800 && c <= 0xdbff) n--;
    cut = text.slice(0, n);
  }
  const body = escapeControls(cut.replace(/\\/g, '\\\\').replace(/"/g, '\\"'));
  return `"${body}"${cut.length < text.length ? '…' : ''}`;
}

export function show(value: unknown): string {
  if (typeof value === 'string') return quote(value);
  return String(value);
}

/**
 * The NPY `descr` field → the element type rhoform can read, or a refusal that names the dtype.
 *
 * Accepted: real numbers and booleans — f2 (IEEE half), f4, f8, i1/i2/i4/i8, u1/u2/u4/u8, b1 — in either
 * byte order ('<' little, '>' big, '|' not applicable, '=' native, taken as little-endian).
 * Everything else (object, complex, structured, strings, datetimes, long double …) is refused by name.
 * Source: NEP 1 (R. Kern, "A simple file format for NumPy arrays", 2007) — `descr` is `dtype.str`
 * for simple types and a list of fields for structured ones.
 */
import { RhoformError, type Where } from '../errors.js';
import { showPyLiteral, type PyLiteral } from './npy-literal.js';

export type NpyKind = 'f' | 'i' | 'u' | 'b';

export interface NpyDtype {
  /** 'f' float, 'i' signed integer, 'u' unsigned integer, 'b' boolean. */
  readonly kind: NpyKind;
  /** Bytes per element. */
  readonly size: 1 | 2 | 4 | 8;
  /** Byte order of multi-byte elements; true for one-byte types. */
  readonly littleEndian: boolean;
  /** The descr string as written in the file, e.g. '<f8'. */
  readonly descr: string;
  /** numpy's name, e.g. 'float64'. */
  readonly name: string;
}

const ACCEPTED = 'a real numeric dtype (f2, f4, f8, i1–i8, u1–u8, b1)';
const SIZES: Record<NpyKind, readonly number[]> = { f: [2, 4, 8], i: [1, 2, 4, 8], u: [1, 2, 4, 8], b: [1] };

/**
 * Interprets a header's `descr` literal.
 * @param where byte offset of the descr value in the file, for the error message.
 * @throws RhoformError E_NPY_DTYPE naming the dtype found (e.g. "complex128 ('<c16')").
 */
export function parseNpyDtype(descr: PyLiteral, where: Where): NpyDtype {
  if (descr.kind === 'list') {
    const names = descr.items
      .map((f) => (f.kind === 'tuple' && f.items[0]?.kind === 'str' ? `'${f.items[0].value}'` : '?'))
      .join(', ');
    throw new RhoformError(
      'E_NPY_DTYPE',
      `expected ${ACCEPTED}, found a structured dtype with fields ${names} (${cut(showPyLiteral(descr))}); save one field, e.g. np.save(f, a['${firstName(descr)}'])`,
      where,
    );
  }
  if (descr.kind !== 'str') {
    throw new RhoformError('E_NPY_DTYPE', `expected ${ACCEPTED} as a string like '<f8', found ${cut(showPyLiteral(descr))}`, where);
  }
  const text = descr.value;
  let rest = text;
  let order = '=';
  if ('<>|='.includes(rest[0] ?? 'x')) {
    order = rest[0];
    rest = rest.slice(1);
  }
  const kindChar = rest[0] ?? '';
  const sizeText = rest.slice(1);
  const size = /^[0-9]+$/.test(sizeText) ? Number(sizeText) : NaN;
  if ((kindChar === 'f' || kindChar === 'i' || kindChar === 'u' || kindChar === 'b') && SIZES[kindChar].includes(size)) {
    return {
      kind: kindChar,
      size: size as 1 | 2 | 4 | 8,
      littleEndian: order !== '>' || size === 1,
      descr: text,
      name: kindChar === 'b' ? 'bool' : `${KIND_NAMES[kindChar]}${size * 8}`,
    };
  }
  const [name, hint] = refusedName(kindChar, sizeText, size);
  throw new RhoformError('E_NPY_DTYPE', `expected ${ACCEPTED}, found ${name} (${showPyLiteral(descr)})${hint ? `; ${hint}` : ''}`, where);
}

const KIND_NAMES: Record<string, string> = { f: 'float', i: 'int', u: 'uint', c: 'complex', b: 'bool' };

/** numpy's name for a dtype we do not read (with the bit count for sized kinds), and a hint where useful. */
function refusedName(kind: string, sizeText: string, size: number): [string, string?] {
  const bits = Number.isFinite(size) ? String(size * 8) : '';
  switch (kind) {
    case 'c':
      return [`complex${bits}`, 'save the real part or the magnitude, e.g. np.save(f, a.real)'];
    case 'f':
    case 'i':
    case 'u':
    case 'b':
      return [bits ? `${KIND_NAMES[kind]}${bits}` : `${KIND_NAMES[kind]} of unknown size`, kind === 'f' ? 'save as float64, e.g. np.save(f, a.astype(np.float64))' : undefined];
    case 'O':
      return ['object', 'pickled Python objects are never loaded; save a numeric array, e.g. np.save(f, a.astype(np.float64))'];
    case 'U':
      return ['str'];
    case 'S':
    case 'a':
      return ['bytes'];
    case 'V':
      return ['void'];
    case 'M':
      return [`datetime64${sizeText.replace(/^8/, '')}`];
    case 'm':
      return [`timedelta64${sizeText.replace(/^8/, '')}`];
    default:
      return ['an unrecognised dtype'];
  }
}

function firstName(descr: PyLiteral): string {
  const f = descr.kind === 'list' ? descr.items[0] : undefined;
  return f?.kind === 'tuple' && f.items[0]?.kind === 'str' ? f.items[0].value : 'name';
}

function cut(s: string): string {
  return s.length > 80 ? `${s.slice(0, 80)}…` : s;
}

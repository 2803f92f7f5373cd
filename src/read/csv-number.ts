/**
 * Number tokens of the CSV reader: a fast path over char codes for plain decimals and a strict slow path
 * for everything else.
 *
 * Grammar (both paths): `[+-]? (digits [mark digits?] | mark digits) ([eE] [+-]? digits)?`, where `mark` is
 * '.' (or ',' with the decimal-comma option), plus the non-finite words `nan` and `inf` / `infinity`
 * (any letter case, optional sign). Hex, binary, digit separators and empty text are not numbers, even
 * where `Number()` would accept them.
 */

/** Exact powers of ten 10^0 … 10^22 (every one is a double without rounding). */
const POW10 = [
  1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18,
  1e19, 1e20, 1e21, 1e22,
];

/**
 * Fast path: parses a plain decimal starting at `p` in `text` and returns its value, or NaN when the text
 * there is not a plain decimal this path can round correctly (the caller then takes the slow path).
 * On success `state.end` is the offset just past the number.
 *
 * Correct rounding: with at most 15 significant digits the digits form an integer m < 2^53 held exactly,
 * and for |k| ≤ 22 the factor 10^|k| is exact too, so m·10^k (or m / 10^−k) is one correctly rounded IEEE
 * operation — W. D. Clinger, "How to read floating point numbers accurately", PLDI 1990,
 * doi:10.1145/93542.93557. Longer digit strings (numpy's '%.17g' writes 17 digits, its default '%.18e' 19)
 * are checked against the grammar here and converted by `Number()` on the token alone.
 */
export function fastNumber(text: string, p: number, end: number, mark: number, state: { end: number }): number {
  let q = p;
  let c = q < end ? text.charCodeAt(q) : -1;
  let neg = false;
  if (c === 45 /* - */ || c === 43 /* + */) {
    neg = c === 45;
    q++;
    c = q < end ? text.charCodeAt(q) : -1;
  }
  let mant = 0;
  let digits = 0;
  while (c >= 48 && c <= 57) {
    mant = mant * 10 + (c - 48);
    digits++;
    q++;
    c = q < end ? text.charCodeAt(q) : -1;
  }
  let frac = 0;
  if (c === mark) {
    q++;
    c = q < end ? text.charCodeAt(q) : -1;
    while (c >= 48 && c <= 57) {
      mant = mant * 10 + (c - 48);
      digits++;
      frac++;
      q++;
      c = q < end ? text.charCodeAt(q) : -1;
    }
  }
  if (digits === 0) return NaN;
  let exp = 0;
  if (c === 101 /* e */ || c === 69 /* E */) {
    q++;
    c = q < end ? text.charCodeAt(q) : -1;
    let eneg = false;
    if (c === 45 || c === 43) {
      eneg = c === 45;
      q++;
      c = q < end ? text.charCodeAt(q) : -1;
    }
    let ed = 0;
    while (c >= 48 && c <= 57) {
      if (ed < 6) exp = exp * 10 + (c - 48);
      ed++;
      q++;
      c = q < end ? text.charCodeAt(q) : -1;
    }
    if (ed === 0 || ed >= 6) return NaN;
    if (eneg) exp = -exp;
  }
  if (digits > 15) {
    // The grammar is checked; Number() rounds the long digit string correctly. A decimal comma takes the slow path.
    if (mark !== 46) return NaN;
    state.end = q;
    return Number(text.slice(p, q));
  }
  const k = exp - frac;
  let v: number;
  if (k === 0 || mant === 0) v = mant;
  else if (k < 0 && k >= -22) v = mant / POW10[-k];
  else if (k > 0 && k <= 22) v = mant * POW10[k];
  else return NaN;
  state.end = q;
  return neg ? -v : v;
}

/**
 * Slow path: the value of a whole token (already cut out, without surrounding spaces or quotes), or
 * `undefined` when it is not a number. `nan` gives NaN and `inf`/`infinity` give ±Infinity (kept for the
 * non-finite policy of src/field/prepare.ts). `decimalComma`: ',' is the decimal mark and '.' is refused
 * (it could be a thousands separator).
 */
export function parseNumberToken(token: string, decimalComma: boolean): number | undefined {
  const n = token.length;
  if (n === 0) return undefined;
  let i = 0;
  let c = token.charCodeAt(0);
  let neg = false;
  if (c === 45 || c === 43) {
    neg = c === 45;
    i = 1;
  }
  const word = token.slice(i).toLowerCase();
  if (word === 'nan') return NaN;
  if (word === 'inf' || word === 'infinity') return neg ? -Infinity : Infinity;
  const mark = decimalComma ? 44 : 46;
  let digits = 0;
  c = i < n ? token.charCodeAt(i) : -1;
  while (c >= 48 && c <= 57) {
    digits++;
    c = ++i < n ? token.charCodeAt(i) : -1;
  }
  const markAt = c === mark ? i : -1;
  if (markAt >= 0) {
    c = ++i < n ? token.charCodeAt(i) : -1;
    while (c >= 48 && c <= 57) {
      digits++;
      c = ++i < n ? token.charCodeAt(i) : -1;
    }
  }
  if (digits === 0) return undefined;
  if (c === 101 || c === 69) {
    c = ++i < n ? token.charCodeAt(i) : -1;
    if (c === 45 || c === 43) c = ++i < n ? token.charCodeAt(i) : -1;
    let ed = 0;
    while (c >= 48 && c <= 57) {
      ed++;
      c = ++i < n ? token.charCodeAt(i) : -1;
    }
    if (ed === 0) return undefined;
  }
  if (i !== n) return undefined;
  // The grammar is ours; Number() only does the correctly rounded conversion.
  const plain = markAt >= 0 && decimalComma ? `${token.slice(0, markAt)}.${token.slice(markAt + 1)}` : token;
  return Number(plain);
}

/**
 * Deterministic decimal formatting for the geometry writers.
 *
 * A number is rounded half away from zero to a fixed count of decimals, trailing zeros are trimmed, and the
 * result never has an exponent, a "-0", a leading "+" or a trailing ".". The same double always gives the
 * same text, on every platform (ECMAScript fixes Number→String exactly).
 */
import { RhoformError } from '../errors.js';

const SCALES = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6] as const;
/** Below this many units of the last decimal, the scaled value and its rounding are exact integers. */
const EXACT_LIMIT = 1e15;
const ZEROS = ['', '0', '00', '000', '0000', '00000'] as const;

/**
 * Formats `value` with at most `decimals` (0…6) decimals: `1.5`, `-0.25`, `3`, `0` (never `-0`).
 * Values within half a unit of the last decimal from zero print as `0`.
 * Throws RhoformError `E_INTERNAL` for NaN or ±Infinity (a writer must never emit them).
 */
export function formatNumber(value: number, decimals: number): string {
  const scale = SCALES[decimals];
  if (scale === undefined) {
    throw new RhoformError('E_INTERNAL', `expected 0…6 decimals, found ${String(decimals)}`);
  }
  const scaled = Math.abs(value) * scale;
  if (scaled < EXACT_LIMIT) {
    // NaN fails this comparison and falls through to the slow path, which rejects it.
    const k = Math.round(scaled);
    if (k === 0) return '0';
    // Integer arithmetic only (exact below 2^53): the digits of k·10^-d, without Number→String of a fraction.
    let frac = k % scale;
    const whole = (k - frac) / scale;
    let text: string;
    if (frac === 0) text = `${whole}`;
    else {
      let digits = decimals;
      while (frac % 10 === 0) {
        frac /= 10;
        digits--;
      }
      const fracText = `${frac}`;
      text = `${whole}.${ZEROS[digits - fracText.length]}${fracText}`;
    }
    return value < 0 ? `-${text}` : text;
  }
  return formatLarge(value, decimals);
}

/** Slow path for |value| ≥ 10^(15 − decimals): toFixed, trimmed. */
function formatLarge(value: number, decimals: number): string {
  if (!Number.isFinite(value)) {
    throw new RhoformError('E_INTERNAL', `expected a finite coordinate, found ${String(value)}`);
  }
  if (!(Math.abs(value) < 1e21)) {
    throw new RhoformError('E_INTERNAL', `expected a coordinate below 1e21, found ${String(value)}`);
  }
  let text = value.toFixed(decimals);
  if (text.includes('.')) text = text.replace(/\.?0+$/, '');
  return text;
}

/**
 * The preview page's settings as command-line words. The page keeps what the user set as the options of a
 * `rhoform build` command line and parses them with the CLI's own parser (cli/args.ts), so a value is accepted,
 * refused and worded exactly as on the command line (DESIGN §13: "an invalid value in apply rejects with the
 * same error code and message the CLI gives"), and the equivalent command line is the state itself.
 *
 * Keys are those of report.settings (camelCase). Pure: no DOM, no Node; used by cli/preview.ts and the page.
 */
import { UsageError } from '../../src/errors.js';
import { resolveSettings, type Settings } from '../../src/settings.js';
import { parseArgs } from '../../cli/args.js';

/** How a settings key is written on the command line. */
type Form =
  | { readonly kind: 'value'; readonly flag: string } // --flag <text>
  | { readonly kind: 'pair'; readonly flag: string } // --flag a or a,b
  | { readonly kind: 'flag'; readonly flag: string } // --flag, no value
  | { readonly kind: 'each'; readonly flag: string } // --flag v, repeated per array item
  | { readonly kind: 'list'; readonly flag: string } // --flag a,b,c
  | { readonly kind: 'repair' } // --repair or --repair=a,b
  | { readonly kind: 'severity' }; // --severity id=level, repeated

const FORMS: Readonly<Record<string, Form>> = {
  cellSize: { kind: 'pair', flag: '--cell-size' },
  rowOrder: { kind: 'value', flag: '--row-order' },
  values: { kind: 'value', flag: '--values' },
  layout: { kind: 'value', flag: '--layout' },
  valueRange: { kind: 'pair', flag: '--value-range' },
  decimalComma: { kind: 'flag', flag: '--decimal-comma' },
  nonFinite: { kind: 'value', flag: '--non-finite' },
  clip: { kind: 'flag', flag: '--clip' },
  maxCells: { kind: 'value', flag: '--max-cells' },
  field: { kind: 'value', flag: '--field' },
  imageSolid: { kind: 'value', flag: '--image-solid' },
  imageChannel: { kind: 'value', flag: '--image-channel' },
  volumeFraction: { kind: 'value', flag: '--volume-fraction' },
  volumeTolerance: { kind: 'value', flag: '--volume-tolerance' },
  level: { kind: 'value', flag: '--level' },
  saddle: { kind: 'value', flag: '--saddle' },
  smooth: { kind: 'value', flag: '--smooth' },
  tolerance: { kind: 'value', flag: '--tolerance' },
  mirror: { kind: 'each', flag: '--mirror' },
  passive: { kind: 'value', flag: '--passive' },
  loads: { kind: 'value', flag: '--loads' },
  maxStiffnessLoss: { kind: 'value', flag: '--max-stiffness-loss' },
  allowableStress: { kind: 'value', flag: '--allowable-stress' },
  feMaxElements: { kind: 'value', flag: '--fe-max-elements' },
  circles: { kind: 'flag', flag: '--circles' },
  minMember: { kind: 'value', flag: '--min-member' },
  minHole: { kind: 'value', flag: '--min-hole' },
  toolRadius: { kind: 'value', flag: '--tool-radius' },
  minIslandArea: { kind: 'value', flag: '--min-island-area' },
  minHoleArea: { kind: 'value', flag: '--min-hole-area' },
  greyWarn: { kind: 'value', flag: '--grey-warn' },
  process: { kind: 'value', flag: '--process' },
  thickness: { kind: 'value', flag: '--thickness' },
  severity: { kind: 'severity' },
  failOn: { kind: 'value', flag: '--fail-on' },
  repair: { kind: 'repair' },
  formats: { kind: 'list', flag: '--formats' },
  units: { kind: 'value', flag: '--units' },
};

/** Settings keys with a command-line option, in the order the options are written. */
export const OPTION_KEYS: readonly string[] = Object.keys(FORMS);

/** Keys of report.settings that no option sets (derived or fixed): apply refuses them. */
const DERIVED = new Set(['cellSizeDefaulted', 'cellSizeSource', 'smoothLambda', 'smoothMu']);

/** The command-line words of one option, `[flag, value]` pairs flattened; a value of null, false or [] is none. */
function text(v: unknown): string {
  return typeof v === 'string' ? v : typeof v === 'number' ? String(v) : JSON.stringify(v) ?? String(v);
}

/** The words for `key` = `value` (null, undefined, false and empty lists give none). Throws UsageError. */
export function wordsOf(key: string, value: unknown): string[] {
  const form = FORMS[key];
  if (!form) {
    if (DERIVED.has(key)) throw new UsageError(`${key}: no command-line option sets it (it follows from the other settings)`);
    throw new UsageError(`unknown setting ${JSON.stringify(key)}: expected one of ${OPTION_KEYS.join(', ')}`);
  }
  if (value === null || value === undefined) return [];
  switch (form.kind) {
    case 'value':
      return [form.flag, text(value)];
    case 'pair':
      return [form.flag, Array.isArray(value) ? (value.length === 2 && value[0] === value[1] && key === 'cellSize' ? text(value[0]) : value.map(text).join(',')) : text(value)];
    case 'flag':
      if (value === false) return [];
      if (value === true) return [form.flag];
      return [`${form.flag}=${text(value)}`]; // the parser refuses it: "--circles takes no value, found …"
    case 'each':
      return (Array.isArray(value) ? value : [value]).flatMap((v) => [form.flag, text(v)]);
    case 'list':
      return [form.flag, Array.isArray(value) ? value.map(text).join(',') : text(value)];
    case 'repair':
      if (value === false || (Array.isArray(value) && value.length === 0)) return [];
      if (value === true) return ['--repair'];
      return [`--repair=${Array.isArray(value) ? value.map(text).join(',') : text(value)}`];
    case 'severity': {
      if (typeof value !== 'object' || Array.isArray(value)) return [`--severity=${text(value)}`];
      return Object.entries(value as Record<string, unknown>).flatMap(([id, level]) => ['--severity', `${id}=${text(level)}`]);
    }
  }
}

/** The options a page holds: settings key → its command-line words, in the order they were set. */
export type OptionWords = ReadonlyMap<string, readonly string[]>;

/** The options of a parsed command line (`parseArgs(...).settings`), as words. */
export function optionWords(given: Partial<Settings>): Map<string, string[]> {
  const out = new Map<string, string[]>();
  for (const key of OPTION_KEYS) {
    const v = (given as Record<string, unknown>)[key];
    if (v === undefined) continue;
    if (key === 'repair' && Array.isArray(v) && v.length === 4) {
      out.set(key, ['--repair']);
      continue;
    }
    const w = wordsOf(key, v);
    if (w.length > 0) out.set(key, w);
  }
  return out;
}

/** The options as one argv list (without command and file). */
export function argvOf(words: OptionWords): string[] {
  return [...words.values()].flat();
}

/**
 * Parses options exactly as `rhoform build <file> …` does and resolves the defaults. Throws the CLI's
 * UsageError (code E_USAGE, the CLI's message) on a bad value.
 */
export function settingsOf(file: string, words: OptionWords): { given: Partial<Settings>; settings: Settings } {
  const parsed = parseArgs(['build', file, ...argvOf(words)]);
  return { given: parsed.settings, settings: resolveSettings(parsed.settings) };
}

function same(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * The options after `changes` (keys as in report.settings). A key whose value equals what the page shows
 * now (`current`, report.settings) and that is not already set is left unset, so `apply(settings())` changes
 * nothing. `passive` and `loads` can be switched off (null) or back on with the embedded file's name only.
 * Throws UsageError (validated by settingsOf, which the caller runs on the result).
 */
export function withChanges(
  words: OptionWords,
  changes: Readonly<Record<string, unknown>>,
  current: Readonly<Record<string, unknown>> | null,
  embeddedPassive: string | null,
  embeddedLoads: string | null = null,
): Map<string, readonly string[]> {
  if (typeof changes !== 'object' || changes === null || Array.isArray(changes)) {
    throw new UsageError(`apply: expected an object of settings (keys as in report.settings), found ${text(changes)}`);
  }
  const out = new Map<string, readonly string[]>(words);
  for (const [key, value] of Object.entries(changes)) {
    const w = wordsOf(key, value);
    if (key === 'passive' && value !== null && value !== undefined && value !== embeddedPassive) {
      throw new UsageError(
        embeddedPassive === null
          ? `--passive: this page embeds no passive-region file, found ${JSON.stringify(value)}; run rhoform preview again with --passive`
          : `--passive: this page embeds only ${JSON.stringify(embeddedPassive)}, found ${JSON.stringify(value)}; run rhoform preview again with the other file`,
      );
    }
    if (key === 'loads' && value !== null && value !== undefined && value !== embeddedLoads) {
      throw new UsageError(
        embeddedLoads === null
          ? `--loads: this page embeds no loads file, found ${JSON.stringify(value)}; run rhoform preview again with --loads`
          : `--loads: this page embeds only ${JSON.stringify(embeddedLoads)}, found ${JSON.stringify(value)}; run rhoform preview again with the other file`,
      );
    }
    if (!out.has(key) && current !== null && same(current[key], value)) continue;
    if (w.length === 0) out.delete(key);
    else out.set(key, w);
  }
  return out;
}

/** A word quoted for a POSIX shell when it needs it. */
export function shellWord(w: string): string {
  return /^[A-Za-z0-9_./,=:@%+-]+$/.test(w) ? w : `'${w.replace(/'/g, `'\\''`)}'`;
}

/** `rhoform build <file> <options…> [--out-dir <dir>]`: the command line that writes the page's downloads. */
export function buildCommand(file: string, words: OptionWords, outDir: string | null): string {
  const argv = ['rhoform', 'build', file, ...argvOf(words), ...(outDir !== null ? ['--out-dir', outDir] : [])];
  return argv.map(shellWord).join(' ');
}

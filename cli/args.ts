/**
 * Strict argv parsing (docs/cli.md). An unknown option or a bad value is a UsageError naming the option.
 * Accepts `--name value` and `--name=value`; flags take no value.
 */
import { UsageError } from '../src/errors.js';
import { isCheckId } from '../src/check/ids.js';
import { PROCESS_IDS } from '../src/check/process.js';
import { MIRROR_EDGES, OUTPUT_FORMATS, REPAIR_IDS, type MirrorEdge, type OutputFormat, type RepairName, type Settings } from '../src/settings.js';

export type Command = 'build' | 'check' | 'inspect' | 'demo' | 'batch' | 'merge' | 'preview' | 'help' | 'version';

export interface CliOptions {
  outDir: string | null;
  json: boolean;
  force: boolean;
  quiet: boolean;
  color: boolean | null;
  /** `batch --jobs n`: worker threads; null = the number of cores. */
  jobs: number | null;
  /** `batch --shard k/n`: this run's share of the sorted file list; null = all of it. */
  shard: { k: number; n: number } | null;
  /** `--timings`: print where the build spent its time on stderr. */
  timings: boolean;
}

export interface ParsedArgs {
  command: Command;
  files: string[];
  settings: Partial<Settings>;
  cli: CliOptions;
}

type Handler = (value: string, out: ParsedArgs) => void;
interface OptionSpec {
  /** Takes a value; 'optional': only as `--name=value`, or a following word that `accepts`. */
  value: boolean | 'optional';
  /** For an optional value: whether the next word is this option's value rather than a file. */
  accepts?: (word: string) => boolean;
  /** Commands that accept it. */
  commands: readonly Command[];
  apply: Handler;
}

const GRID_CMDS: readonly Command[] = ['build', 'check', 'inspect', 'batch', 'preview'];
const RUN_CMDS: readonly Command[] = ['build', 'check', 'demo', 'batch', 'preview'];
const OUT_CMDS: readonly Command[] = ['build', 'check', 'demo', 'batch', 'merge', 'preview'];
const GEOMETRY_CMDS: readonly Command[] = ['build', 'demo', 'batch', 'preview'];
const ALL_RUN_CMDS: readonly Command[] = ['build', 'check', 'inspect', 'demo', 'batch', 'merge', 'preview'];

function repairList(v: string): RepairName[] {
  const parts = v.split(',').map((p) => p.trim());
  for (const p of parts) {
    if (!(REPAIR_IDS as readonly string[]).includes(p)) {
      throw new UsageError(`--repair: expected a comma-separated list of ${REPAIR_IDS.join(', ')}, found ${JSON.stringify(p)}`);
    }
  }
  return parts as RepairName[];
}

function isRepairList(word: string): boolean {
  return word.split(',').every((p) => (REPAIR_IDS as readonly string[]).includes(p.trim()));
}

function num(name: string, v: string, test: (x: number) => boolean, expected: string): number {
  const x = v.trim() === '' ? NaN : Number(v);
  if (!Number.isFinite(x) || !test(x)) throw new UsageError(`${name}: expected ${expected}, found ${JSON.stringify(v)}`);
  return x;
}

function oneOf<T extends string>(name: string, v: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(v)) {
    throw new UsageError(`${name}: expected one of ${allowed.join(', ')}, found ${JSON.stringify(v)}`);
  }
  return v as T;
}

function pair(name: string, v: string, test: (x: number) => boolean, expected: string): [number, number] {
  const parts = v.split(',');
  if (parts.length === 1) {
    const x = num(name, parts[0], test, expected);
    return [x, x];
  }
  if (parts.length !== 2) throw new UsageError(`${name}: expected one value or two separated by a comma, found ${JSON.stringify(v)}`);
  return [num(name, parts[0], test, expected), num(name, parts[1], test, expected)];
}

const OPTIONS: Record<string, OptionSpec> = {
  // input
  'cell-size': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.cellSize = pair('--cell-size', v, (x) => x > 0, 'a cell size in mm > 0 (or hx,hy)')) },
  'row-order': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.rowOrder = oneOf('--row-order', v, ['top-down', 'bottom-up'] as const)) },
  values: { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.values = oneOf('--values', v, ['cells', 'nodes'] as const)) },
  layout: { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.layout = oneOf('--layout', v, ['grid', 'long', 'auto'] as const)) },
  'value-range': {
    value: true,
    commands: [...GRID_CMDS],
    apply: (v, o) => {
      const parts = v.split(',');
      if (parts.length !== 2) throw new UsageError(`--value-range: expected lo,hi, found ${JSON.stringify(v)}`);
      const lo = num('--value-range', parts[0], () => true, 'a number');
      const hi = num('--value-range', parts[1], () => true, 'a number');
      if (!(hi > lo)) throw new UsageError(`--value-range: expected lo < hi, found ${JSON.stringify(v)}`);
      o.settings.valueRange = [lo, hi];
    },
  },
  'decimal-comma': { value: false, commands: [...GRID_CMDS], apply: (_v, o) => (o.settings.decimalComma = true) },
  'non-finite': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.nonFinite = oneOf('--non-finite', v, ['error', 'void'] as const)) },
  clip: { value: false, commands: [...GRID_CMDS], apply: (_v, o) => (o.settings.clip = true) },
  'max-cells': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.maxCells = num('--max-cells', v, (x) => Number.isInteger(x) && x >= 1, 'a whole number ≥ 1')) },
  field: {
    value: true,
    commands: [...GRID_CMDS],
    apply: (v, o) => {
      if (v === '') throw new UsageError('--field: expected the name of a variable or array in the file, found ""');
      o.settings.field = v;
    },
  },
  'image-solid': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.imageSolid = oneOf('--image-solid', v, ['dark', 'light'] as const)) },
  'image-channel': { value: true, commands: [...GRID_CMDS], apply: (v, o) => (o.settings.imageChannel = oneOf('--image-channel', v, ['luminance', 'r', 'g', 'b'] as const)) },
  // geometry
  'volume-fraction': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.volumeFraction = num('--volume-fraction', v, (x) => x >= 0 && x <= 1, 'a fraction from 0 to 1')) },
  'volume-tolerance': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.volumeTolerance = num('--volume-tolerance', v, (x) => x > 0 && x < 1, 'a relative tolerance > 0 and < 1')) },
  level: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.level = num('--level', v, () => true, 'a number (iso-level after --value-range mapping, usually 0..1)')) },
  saddle: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.saddle = oneOf('--saddle', v, ['decider', 'join', 'split'] as const)) },
  smooth: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.smooth = num('--smooth', v, (x) => Number.isInteger(x) && x >= 0 && x <= 1000, 'a whole number of iterations from 0 to 1000')) },
  tolerance: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.tolerance = num('--tolerance', v, (x) => x >= 0, 'a length in mm ≥ 0')) },
  mirror: {
    value: true,
    commands: [...RUN_CMDS],
    apply: (v, o) => {
      const edge: MirrorEdge = oneOf('--mirror', v, MIRROR_EDGES);
      const list = o.settings.mirror ?? [];
      if (list.includes(edge)) throw new UsageError(`--mirror: expected each edge at most once, found ${JSON.stringify(edge)} twice`);
      const opposite: Record<MirrorEdge, MirrorEdge> = { left: 'right', right: 'left', bottom: 'top', top: 'bottom' };
      if (list.includes(opposite[edge])) {
        throw new UsageError(`--mirror: expected at most one of left/right and one of bottom/top, found both ${opposite[edge]} and ${edge}`);
      }
      o.settings.mirror = [...list, edge];
    },
  },
  passive: {
    value: true,
    commands: [...RUN_CMDS],
    apply: (v, o) => {
      if (v.trim() === '') throw new UsageError(`--passive: expected a passive-region file (JSON), found ""`);
      o.settings.passive = v;
    },
  },
  circles: { value: false, commands: [...GEOMETRY_CMDS], apply: (_v, o) => (o.settings.circles = true) },
  // checks (docs/checks/)
  'min-member': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.minMember = num('--min-member', v, (x) => x > 0, 'a width in mm > 0')) },
  'min-hole': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.minHole = num('--min-hole', v, (x) => x > 0, 'a width in mm > 0')) },
  'tool-radius': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.toolRadius = num('--tool-radius', v, (x) => x > 0, 'a radius in mm > 0')) },
  'min-island-area': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.minIslandArea = num('--min-island-area', v, (x) => x >= 0, 'an area in mm² ≥ 0')) },
  'min-hole-area': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.minHoleArea = num('--min-hole-area', v, (x) => x > 0, 'an area in mm² > 0')) },
  'grey-warn': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.greyWarn = num('--grey-warn', v, (x) => x >= 0 && x <= 100, 'a percentage from 0 to 100')) },
  process: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.process = oneOf('--process', v, PROCESS_IDS)) },
  thickness: { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.thickness = num('--thickness', v, (x) => x > 0, 'a sheet thickness in mm > 0')) },
  severity: {
    value: true,
    commands: [...RUN_CMDS],
    apply: (v, o) => {
      const eq = v.indexOf('=');
      const id = eq >= 0 ? v.slice(0, eq) : v;
      if (eq < 0 || !isCheckId(id)) {
        throw new UsageError(`--severity: expected <check id>=off|warn|fail with a check id of docs/checks/, found ${JSON.stringify(v)}`);
      }
      const level = oneOf('--severity', v.slice(eq + 1), ['off', 'warn', 'fail'] as const);
      o.settings.severity = { ...(o.settings.severity ?? {}), [id]: level };
    },
  },
  'fail-on': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.failOn = oneOf('--fail-on', v, ['warn', 'fail'] as const)) },
  repair: {
    value: 'optional',
    accepts: isRepairList,
    commands: [...RUN_CMDS],
    apply: (v, o) => (o.settings.repair = v === '' ? [...REPAIR_IDS] : repairList(v)),
  },
  // structural re-check (docs/structure.md)
  loads: {
    value: true,
    commands: [...RUN_CMDS],
    apply: (v, o) => {
      if (v.trim() === '') throw new UsageError(`--loads: expected a loads file (JSON), found ""`);
      o.settings.loads = v;
    },
  },
  'max-stiffness-loss': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.maxStiffnessLoss = num('--max-stiffness-loss', v, (x) => x >= 0, 'a compliance increase in % ≥ 0')) },
  'allowable-stress': { value: true, commands: [...RUN_CMDS], apply: (v, o) => (o.settings.allowableStress = num('--allowable-stress', v, (x) => x > 0, 'a stress in MPa > 0')) },
  'fe-max-elements': {
    value: true,
    commands: [...RUN_CMDS],
    apply: (v, o) => (o.settings.feMaxElements = num('--fe-max-elements', v, (x) => Number.isInteger(x) && x >= 1, 'a whole number of elements ≥ 1')),
  },
  // batch
  jobs: { value: true, commands: ['batch'], apply: (v, o) => (o.cli.jobs = num('--jobs', v, (x) => Number.isInteger(x) && x >= 1 && x <= 256, 'a whole number of workers from 1 to 256')) },
  shard: {
    value: true,
    commands: ['batch'],
    apply: (v, o) => {
      const m = /^(\d+)\/(\d+)$/.exec(v.trim());
      const k = m ? Number(m[1]) : NaN;
      const n = m ? Number(m[2]) : NaN;
      if (!m || !(n >= 1) || !(k >= 1) || k > n) throw new UsageError(`--shard: expected k/n with 1 ≤ k ≤ n (e.g. 3/8), found ${JSON.stringify(v)}`);
      o.cli.shard = { k, n };
    },
  },
  // output
  'out-dir': { value: true, commands: [...OUT_CMDS], apply: (v, o) => (o.cli.outDir = v) },
  formats: {
    value: true,
    commands: [...GEOMETRY_CMDS],
    apply: (v, o) => {
      const list = v.split(',').map((f) => oneOf('--formats', f.trim(), OUTPUT_FORMATS));
      o.settings.formats = [...new Set<OutputFormat>(list)];
    },
  },
  units: { value: true, commands: [...GEOMETRY_CMDS], apply: (v, o) => (o.settings.units = oneOf('--units', v, ['mm', 'in'] as const)) },
  annotations: { value: false, commands: [...GEOMETRY_CMDS], apply: (_v, o) => (o.settings.annotations = true) },
  arcs: { value: false, commands: [...GEOMETRY_CMDS], apply: (_v, o) => (o.settings.arcs = true) },
  'dxf-version': { value: true, commands: [...GEOMETRY_CMDS], apply: (v, o) => (o.settings.dxfVersion = oneOf('--dxf-version', v, ['r12', 'r2000'] as const)) },
  json: { value: false, commands: [...ALL_RUN_CMDS], apply: (_v, o) => (o.cli.json = true) },
  force: { value: false, commands: [...OUT_CMDS], apply: (_v, o) => (o.cli.force = true) },
  quiet: { value: false, commands: [...ALL_RUN_CMDS], apply: (_v, o) => (o.cli.quiet = true) },
  timings: { value: false, commands: ['build', 'check', 'demo'], apply: (_v, o) => (o.cli.timings = true) },
  'no-color': { value: false, commands: [...ALL_RUN_CMDS], apply: (_v, o) => (o.cli.color = false) },
};

const COMMANDS: readonly Command[] = ['build', 'check', 'inspect', 'demo', 'batch', 'merge', 'preview'];

/** Parse argv (without node and script). Throws UsageError. */
export function parseArgs(argv: readonly string[]): ParsedArgs {
  const out: ParsedArgs = {
    command: 'help',
    files: [],
    settings: {},
    cli: { outDir: null, json: false, force: false, quiet: false, color: null, jobs: null, shard: null, timings: false },
  };
  if (argv.length === 0) return out;
  const first = argv[0];
  if (first === '--help' || first === '-h' || first === 'help') return out;
  if (first === '--version' || first === '-V') return { ...out, command: 'version' };
  if (!(COMMANDS as readonly string[]).includes(first)) {
    throw new UsageError(`expected a command (${COMMANDS.join(', ')}), found ${JSON.stringify(first)}; see rhoform --help`);
  }
  out.command = first as Command;
  let onlyFiles = false;
  for (let k = 1; k < argv.length; k++) {
    const a = argv[k];
    if (onlyFiles || !a.startsWith('--') || a === '-') {
      if (a.startsWith('-') && a !== '-' && !onlyFiles) throw new UsageError(`unknown option ${JSON.stringify(a)}; see rhoform --help`);
      out.files.push(a);
      continue;
    }
    if (a === '--') {
      onlyFiles = true;
      continue;
    }
    if (a === '--help') return { ...out, command: 'help' };
    const eq = a.indexOf('=');
    const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
    const spec = OPTIONS[name];
    if (!spec) throw new UsageError(`unknown option --${name}; see rhoform --help`);
    if (!spec.commands.includes(out.command)) throw new UsageError(`option --${name} does not apply to '${out.command}'`);
    let value = '';
    if (spec.value === 'optional') {
      if (eq >= 0) {
        value = a.slice(eq + 1);
        if (value === '') throw new UsageError(`--${name}=: expected a value after '=', found nothing`);
      } else if (k + 1 < argv.length && spec.accepts?.(argv[k + 1])) value = argv[++k];
    } else if (spec.value) {
      if (eq >= 0) value = a.slice(eq + 1);
      else {
        if (k + 1 >= argv.length) throw new UsageError(`--${name}: expected a value, found the end of the command line`);
        value = argv[++k];
      }
    } else if (eq >= 0) {
      throw new UsageError(`--${name} takes no value, found ${JSON.stringify(a.slice(eq + 1))}`);
    }
    spec.apply(value, out);
  }
  const s = out.settings;
  if (s.loads === undefined || s.loads === null) {
    for (const [key, name] of [['maxStiffnessLoss', '--max-stiffness-loss'], ['allowableStress', '--allowable-stress'], ['feMaxElements', '--fe-max-elements']] as const) {
      if (s[key] !== undefined && out.command !== 'demo') throw new UsageError(`${name}: applies to the structural re-check, which needs --loads <file.json>`);
    }
  }
  if (out.command === 'demo') {
    if (out.files.length > 0) throw new UsageError(`demo takes no grid file, found ${JSON.stringify(out.files[0])}`);
  } else if (out.command === 'batch' || out.command === 'merge') {
    if (out.files.length === 0) {
      throw new UsageError(
        out.command === 'batch' ? 'batch: expected grid files or folders, found none' : 'merge: expected batch summary files (JSON), found none',
      );
    }
  } else if (out.files.length !== 1) {
    throw new UsageError(
      out.files.length === 0 ? `${out.command}: expected a grid file (CSV, NPY, MAT, VTK, VTI or PNG), found none` : `${out.command}: expected one grid file, found ${out.files.length}`,
    );
  }
  return out;
}

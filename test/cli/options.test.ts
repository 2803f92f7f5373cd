/**
 * The options added for design intent, repair and batch (docs/cli.md): parsed strictly, a bad value is a usage
 * error naming the option (exit 2), and each reaches the settings or the CLI options. Contract tests of our own
 * interface — no outside source applies.
 */
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { UsageError } from '../../src/errors.js';
import { REPAIR_IDS, resolveSettings } from '../../src/settings.js';

const usage = (argv: string[]) => {
  try {
    parseArgs(argv);
  } catch (e) {
    expect(e).toBeInstanceOf(UsageError);
    return (e as Error).message;
  }
  throw new Error(`expected a usage error for ${argv.join(' ')}`);
};

describe('--repair', () => {
  it('alone means every repair, in their fixed order', () => {
    expect(parseArgs(['build', 'g.npy', '--repair']).settings.repair).toEqual([...REPAIR_IDS]);
    expect(parseArgs(['build', '--repair', 'g.npy']).files).toEqual(['g.npy']); // a file is not a repair list
  });

  it('takes a list with = or as the next word; resolveSettings keeps the run order', () => {
    expect(parseArgs(['build', 'g.npy', '--repair=fill-holes,thicken']).settings.repair).toEqual(['fill-holes', 'thicken']);
    expect(resolveSettings(parseArgs(['build', 'g.npy', '--repair=fill-holes,thicken']).settings).repair).toEqual(['thicken', 'fill-holes']);
    expect(parseArgs(['build', '--repair', 'drop-islands', 'g.npy']).settings.repair).toEqual(['drop-islands']);
  });

  it('refuses an unknown repair and an empty list, naming the option', () => {
    expect(usage(['build', 'g.npy', '--repair=thicken,paint'])).toMatch(/--repair: expected .*thicken.*found "paint"/);
    expect(usage(['build', 'g.npy', '--repair='])).toMatch(/--repair=: expected a value/);
    expect(usage(['inspect', 'g.npy', '--repair'])).toMatch(/--repair does not apply to 'inspect'/);
  });
});

describe('--mirror, --passive, --circles', () => {
  it('--mirror is repeatable for a quarter model, in the order given', () => {
    expect(parseArgs(['build', 'g.npy', '--mirror', 'left', '--mirror=bottom']).settings.mirror).toEqual(['left', 'bottom']);
  });

  it('--mirror refuses a repeated edge, both edges of one axis and unknown edges', () => {
    expect(usage(['build', 'g.npy', '--mirror', 'left', '--mirror', 'left'])).toMatch(/at most once/);
    expect(usage(['build', 'g.npy', '--mirror', 'top', '--mirror', 'bottom'])).toMatch(/at most one of left\/right and one of bottom\/top/);
    expect(usage(['build', 'g.npy', '--mirror', 'middle'])).toMatch(/--mirror: expected one of left, right, bottom, top, found "middle"/);
  });

  it('--passive takes a file; --circles is a flag that does not apply to check (no geometry there)', () => {
    expect(parseArgs(['check', 'g.npy', '--passive', 'p.json']).settings.passive).toBe('p.json');
    expect(parseArgs(['build', 'g.npy', '--circles']).settings.circles).toBe(true);
    expect(usage(['check', 'g.npy', '--circles'])).toMatch(/--circles does not apply to 'check'/);
    expect(usage(['build', 'g.npy', '--circles=yes'])).toMatch(/--circles takes no value/);
  });
});

describe('batch options', () => {
  it('--jobs and --shard k/n', () => {
    const a = parseArgs(['batch', 'runs/', '--jobs', '3', '--shard', '2/5']);
    expect(a.cli.jobs).toBe(3);
    expect(a.cli.shard).toEqual({ k: 2, n: 5 });
    expect(a.files).toEqual(['runs/']);
  });

  it('refuses a shard outside 1..n, a malformed shard and zero jobs', () => {
    expect(usage(['batch', 'runs/', '--shard', '0/4'])).toMatch(/--shard: expected k\/n with 1 ≤ k ≤ n/);
    expect(usage(['batch', 'runs/', '--shard', '5/4'])).toMatch(/--shard/);
    expect(usage(['batch', 'runs/', '--shard', 'two'])).toMatch(/--shard/);
    expect(usage(['batch', 'runs/', '--jobs', '0'])).toMatch(/--jobs: expected a whole number/);
    expect(usage(['build', 'g.npy', '--jobs', '2'])).toMatch(/--jobs does not apply to 'build'/);
  });

  it('batch and merge need at least one path', () => {
    expect(usage(['batch'])).toMatch(/batch: expected grid files or folders, found none/);
    expect(usage(['merge'])).toMatch(/merge: expected batch summary files/);
  });
});

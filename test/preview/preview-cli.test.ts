/**
 * `rhoform preview` on the command line: what the page embeds, the size limit, the overwrite rule, and the
 * pieces the page shares with the CLI (the option words, the browser stand-ins for node:crypto and Buffer).
 * The page itself is tested in a browser: test/browser/preview.test.ts.
 */
import { createHash, randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { constants as nodeConstants, deflateSync, inflateSync, inflateSync as nodeInflate } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseArgs } from '../../cli/args.js';
import { resolveSettings } from '../../src/settings.js';
import { bundle } from '../../scripts/bundle.mjs';
import { buildCommand, optionWords, settingsOf, withChanges } from '../../web/shared/options.js';
import type { Embedded } from '../../web/shared/protocol.js';
import { base64 } from '../../web/shims/buffer.js';
import { sha256Hex } from '../../web/shims/sha256.js';
import { constants, inflateSync as shimInflate } from '../../web/shims/zlib.js';
import { cli } from '../cli/harness.js';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DEMO = 'fixtures/grids/demo-bracket.npy';
const PASSIVE = 'fixtures/passive/demo-bracket.passive.json';
const LOADS = 'fixtures/loads/demo-bracket.loads.json';

/** The JSON the page embeds. */
function embedded(html: string): Embedded {
  const m = /<script type="application\/json" id="rhoform-data">(.*?)<\/script>/s.exec(html);
  expect(m, 'embedded data').not.toBeNull();
  return JSON.parse(m![1]) as Embedded;
}

/** A float32 NPY file of ny × nx zeros (NPY format 1.0: magic, version, header length, dict, padding to 64). */
function zerosNpy(ny: number, nx: number): Uint8Array {
  let header = `{'descr': '<f4', 'fortran_order': False, 'shape': (${ny}, ${nx}), }`;
  while ((10 + header.length + 1) % 64 !== 0) header += ' ';
  header += '\n';
  const out = new Uint8Array(10 + header.length + 4 * nx * ny);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, header.length & 0xff, header.length >> 8]);
  for (let k = 0; k < header.length; k++) out[10 + k] = header.charCodeAt(k);
  return out;
}

describe('rhoform preview (command line)', () => {
  let dir = '';
  beforeAll(async () => {
    await bundle();
    dir = mkdtempSync(join(tmpdir(), 'rhoform-preview-'));
  }, 60_000);
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('writes <name>.preview.html with the grid file and the passive file inside, byte for byte, and the options given', () => {
    const out = join(dir, 'a');
    const argv = ['preview', DEMO, '--cell-size', '2', '--process', 'waterjet-cut', '--thickness', '8', '--passive', PASSIVE, '--repair', '--out-dir', out];
    const r = cli(argv, ROOT);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const page = join(out, 'demo-bracket.preview.html');
    expect(r.stdout).toContain(page);
    const html = readFileSync(page, 'utf8');
    const d = embedded(html);
    expect(d.file).toBe(DEMO);
    expect(new Uint8Array(inflateSync(Buffer.from(d.grid, 'base64')))).toEqual(new Uint8Array(readFileSync(join(ROOT, DEMO))));
    expect(Buffer.from(d.passive!.bytes, 'base64')).toEqual(readFileSync(join(ROOT, PASSIVE)));
    expect(d.given).toEqual(parseArgs(argv).settings);
    expect(d.outDir).toBe(out);
    expect(d.outputsBase).toBe(join(out, 'demo-bracket'));
    // self-contained: no external reference (scripts and styles inline)
    expect(html).not.toMatch(/<script[^>]+src=|<link[^>]+href=|@import/);
    expect(html).toContain('<script type="text/plain" id="rhoform-worker">');
  });

  it('never replaces an existing page without --force, and does with it', () => {
    const out = join(dir, 'b');
    expect(cli(['preview', DEMO, '--out-dir', out], ROOT).code).toBe(0);
    const page = join(out, 'demo-bracket.preview.html');
    writeFileSync(page, 'mine');
    const again = cli(['preview', DEMO, '--out-dir', out], ROOT);
    expect(again.code).toBe(2);
    expect(again.stderr).toContain('E_OUTPUT_EXISTS');
    expect(readFileSync(page, 'utf8')).toBe('mine');
    expect(cli(['preview', DEMO, '--out-dir', out, '--force'], ROOT).code).toBe(0);
    expect(readFileSync(page, 'utf8')).toContain('rhoform-data');
  });

  it('refuses a grid above 2 000 000 samples with a message naming --max-cells, writing nothing', () => {
    const grid = join(dir, 'big.npy');
    writeFileSync(grid, zerosNpy(1000, 2001));
    const out = join(dir, 'c');
    const r = cli(['preview', grid, '--out-dir', out], ROOT);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('E_GRID_SIZE');
    expect(r.stderr).toContain('--max-cells 2001000');
    expect(r.stderr).toContain('1000×2001 = 2001000');
    expect(existsSync(out)).toBe(false);
    // 2000 × 1000 is within the limit (docs/preview.md)
    writeFileSync(grid, zerosNpy(1000, 2000));
    expect(cli(['preview', grid, '--out-dir', out], ROOT).code).toBe(0);
  }, 60_000);

  it('refuses bad options as build does (same code and message)', () => {
    const p = cli(['preview', DEMO, '--min-member', 'abc'], ROOT);
    const b = cli(['build', DEMO, '--min-member', 'abc'], ROOT);
    expect(p.code).toBe(2);
    expect(p.stderr).toBe(b.stderr);
    const p2 = cli(['preview', DEMO, '--process', 'waterjet-cut', '--out-dir', join(dir, 'd')], ROOT);
    const b2 = cli(['build', DEMO, '--process', 'waterjet-cut', '--out-dir', join(dir, 'd')], ROOT);
    expect(p2.code).toBe(2);
    expect(p2.stderr).toBe(b2.stderr);
    expect(existsSync(join(dir, 'd'))).toBe(false);
    // a loads file is read and parsed as build reads it: a missing or bad one is refused the same way, nothing written
    const p3 = cli(['preview', DEMO, '--loads', 'any.json', '--out-dir', join(dir, 'e')], ROOT);
    const b3 = cli(['build', DEMO, '--loads', 'any.json', '--out-dir', join(dir, 'e')], ROOT);
    expect(p3.code).toBe(2);
    expect(p3.stderr).toBe(b3.stderr);
    expect(existsSync(join(dir, 'e'))).toBe(false);
  });

  it('embeds the loads file byte for byte (--loads), with the structure options as the starting state', () => {
    const out = join(dir, 'f');
    const argv = ['preview', DEMO, '--cell-size', '2', '--loads', LOADS, '--allowable-stress', '30', '--max-stiffness-loss', '5', '--out-dir', out];
    const r = cli(argv, ROOT);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const d = embedded(readFileSync(join(out, 'demo-bracket.preview.html'), 'utf8'));
    expect(Buffer.from(d.loads!.bytes, 'base64')).toEqual(readFileSync(join(ROOT, LOADS)));
    expect(d.loads!.name).toBe(LOADS);
    expect(d.given).toEqual(parseArgs(argv).settings);
    expect(d.given).toMatchObject({ loads: LOADS, allowableStress: 30, maxStiffnessLoss: 5 });
  });
});

describe('the page state as command-line words (web/shared/options.ts)', () => {
  const argvs = [
    ['--cell-size', '2', '--process', 'waterjet-cut', '--thickness', '8', '--passive', PASSIVE, '--repair'],
    ['--cell-size', '0.5,0.25', '--row-order', 'bottom-up', '--value-range', '0,255', '--clip', '--max-cells', '99', '--volume-fraction', '0.4'],
    ['--field', 'density', '--image-solid', 'light', '--image-channel', 'g'],
    ['--level', '0.3', '--saddle', 'split', '--smooth', '0', '--tolerance', '0.1', '--mirror', 'left', '--mirror', 'top', '--circles'],
    ['--min-member', '2.5', '--min-hole', '3', '--tool-radius', '1e-1', '--min-island-area', '4', '--min-hole-area', '5', '--grey-warn', '30'],
    ['--loads', LOADS, '--max-stiffness-loss', '12.5', '--allowable-stress', '40', '--fe-max-elements', '20000'],
    ['--severity', 'islands=fail', '--severity', 'grey-level=off', '--fail-on', 'warn', '--repair=fill-holes,thicken', '--formats', 'dxf,json', '--units', 'in'],
  ];
  it.each(argvs)('round-trips %s…: the words parse back to the same settings', (...argv) => {
    const given = parseArgs(['build', DEMO, ...argv]).settings;
    const again = settingsOf(DEMO, optionWords(given));
    expect(again.given).toEqual(given);
    expect(again.settings).toEqual(resolveSettings(given));
  });

  it('applies changes: a value sets an option, null removes it, an unchanged value adds nothing', () => {
    const words = optionWords(parseArgs(['build', DEMO, '--cell-size', '2', '--min-member', '6']).settings);
    const current = { minMember: 6, tolerance: 0.5, level: null };
    const next = withChanges(words, { minMember: null, tolerance: 0.5, level: 0.4, volumeFraction: null }, current, null);
    expect(buildCommand(DEMO, next, null)).toBe(`rhoform build ${DEMO} --cell-size 2 --level 0.4`);
    expect(() => withChanges(words, { cellSizeDefaulted: false }, current, null)).toThrow(/no command-line option/);
    expect(() => withChanges(words, { passive: 'other.json' }, current, null)).toThrow(/embeds no passive-region file/);
    expect(() => withChanges(words, { loads: 'other.json' }, current, null, LOADS)).toThrow(/embeds only/);
    expect(withChanges(words, { loads: LOADS }, current, null, LOADS).get('loads')).toEqual(['--loads', LOADS]);
    expect(buildCommand('my grid.npy', next, 'out dir')).toBe("rhoform build 'my grid.npy' --cell-size 2 --level 0.4 --out-dir 'out dir'");
  });
});

describe('browser stand-ins for Node built-ins (web/shims/)', () => {
  it('sha256 matches FIPS 180-2 appendix B.1 ("abc") and node:crypto on random inputs of every padding length', () => {
    // FIPS PUB 180-2, Appendix B.1: SHA-256("abc")
    expect(sha256Hex(new TextEncoder().encode('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    for (let n = 0; n < 200; n++) {
      const b = new Uint8Array(randomBytes(n));
      expect(sha256Hex(b), `length ${n}`).toBe(createHash('sha256').update(b).digest('hex'));
    }
    const big = new Uint8Array(randomBytes(1 << 20));
    expect(sha256Hex(big)).toBe(createHash('sha256').update(big).digest('hex'));
  });

  it('inflateSync matches node:zlib on whole streams, within maxOutputLength, and on a cut stream with Z_SYNC_FLUSH', () => {
    const data = new Uint8Array(200_000);
    for (let k = 0; k < data.length; k++) data[k] = (k * 7919) % 251 > 120 ? k & 255 : 0;
    const z = new Uint8Array(deflateSync(data, { level: 6 }));
    expect(shimInflate(z)).toEqual(new Uint8Array(nodeInflate(z)));
    expect(() => shimInflate(z, { maxOutputLength: 1000 })).toThrow(RangeError);
    const cut = z.subarray(0, Math.floor(z.length / 2));
    const a = shimInflate(cut, { finishFlush: constants.Z_SYNC_FLUSH });
    const b = new Uint8Array(nodeInflate(cut, { finishFlush: nodeConstants.Z_SYNC_FLUSH }));
    expect(a.length).toBeGreaterThan(0);
    expect(a).toEqual(data.subarray(0, a.length)); // a prefix of the data, as Node gives one
    expect(b).toEqual(data.subarray(0, b.length));
    expect(() => shimInflate(cut)).toThrow();
  });

  it('base64 matches Node Buffer for every tail length', () => {
    for (let n = 0; n < 50; n++) {
      const b = new Uint8Array(randomBytes(n));
      expect(base64(b)).toBe(Buffer.from(b).toString('base64'));
    }
  });
});

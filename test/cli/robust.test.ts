/**
 * The CLI on inputs that once hung, crashed or left files behind (issue 11): each gives a result, or one clean
 * line on stderr with exit 2 and nothing written.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { removeOwnTemps } from '../../cli/files.js';
import { cli, tempDir } from './harness.js';

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f]/;

/** One line on stderr, with its code, and nothing on stdout. */
function oneCleanLine(r: { code: number; stdout: string; stderr: string }, code: string): void {
  expect(r.code).toBe(2);
  expect(r.stdout).toBe('');
  expect(r.stderr.split('\n').filter((l) => l !== '')).toHaveLength(1);
  expect(r.stderr).not.toMatch(CONTROL);
  expect(r.stderr).toContain(`error ${code}:`);
}

describe('inputs that are not regular files are refused by what they are', () => {
  it('a named pipe called x.npy: E_INPUT_READ at once (it used to block forever)', () => {
    const dir = tempDir();
    execFileSync('mkfifo', [join(dir, 'x.npy')]);
    const r = cli(['build', 'x.npy'], dir);
    oneCleanLine(r, 'E_INPUT_READ');
    expect(r.stderr).toMatch(/x\.npy: expected the input to be a regular file, found a named pipe \(FIFO\)/);
  });

  it('/dev/zero behind a .npy name and /dev/urandom behind a .csv name: a character device, refused', () => {
    const dir = tempDir();
    symlinkSync('/dev/zero', join(dir, 'z.npy'));
    symlinkSync('/dev/urandom', join(dir, 'u.csv'));
    for (const f of ['z.npy', 'u.csv']) {
      const r = cli(['build', f], dir);
      oneCleanLine(r, 'E_INPUT_READ');
      expect(r.stderr).toContain('found a character device');
    }
    expect(readdirSync(dir).sort()).toEqual(['u.csv', 'z.npy']);
  });

  it('a passive-region file that is a named pipe is refused the same way', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'g.csv'), '0,1\n1,0\n');
    execFileSync('mkfifo', [join(dir, 'p.json')]);
    const r = cli(['build', 'g.csv', '--passive', 'p.json'], dir);
    oneCleanLine(r, 'E_INPUT_READ');
    expect(r.stderr).toContain('p.json: expected the passive-region file to be a regular file');
  });
});

describe('a file larger than --max-cells can hold is refused before it is read', () => {
  it('a 1.2 MB CSV with --max-cells 100: E_GRID_SIZE naming the bound', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'big.csv'), '0.5,'.repeat(300_000) + '0.5\n');
    const r = cli(['build', 'big.csv', '--max-cells', '100'], dir);
    oneCleanLine(r, 'E_GRID_SIZE');
    // bound: 100 samples × 128 bytes + 1 MiB (src/read/byte-limit.ts)
    expect(r.stderr).toContain(`at most ${100 * 128 + 1048576} bytes (for --max-cells 100), found 1200004 bytes`);
  });

  it('an NPY file declaring 10 × 10 float64 samples may hold 800 data bytes; 70 kB more is refused', () => {
    const dir = tempDir();
    const header = "{'descr': '<f8', 'fortran_order': False, 'shape': (10, 10), }";
    const h = header.padEnd(118, ' ') + '\n'; // 10 + 118 = 128: data from byte 128, as numpy aligns it
    const pre = Buffer.from([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, h.length, 0]);
    writeFileSync(join(dir, 'ok.npy'), Buffer.concat([pre, Buffer.from(h, 'latin1'), Buffer.alloc(800)]));
    writeFileSync(join(dir, 'big.npy'), Buffer.concat([pre, Buffer.from(h, 'latin1'), Buffer.alloc(800 + 70_000)]));
    expect(cli(['inspect', 'ok.npy', '--max-cells', '100'], dir).code).toBe(0);
    oneCleanLine(cli(['inspect', 'big.npy', '--max-cells', '100'], dir), 'E_GRID_SIZE');
  });
});

describe('temp files a killed run left are removed by the next run; others are left alone', () => {
  it('stale <output>.<dead pid>.<hex>.tmp and old-style <output>.<hex>.tmp go; another name or a live pid stays', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'g.csv'), '0,1,1\n1,1,0\n0,1,1\n');
    const stale = ['g.dxf.2147483646.0badf00d.tmp', 'g.svg.deadbeef.tmp'];
    const keep = ['h.dxf.2147483646.0badf00d.tmp', `g.dxf.${process.pid}.12345678.tmp`, 'g.dxf.notes.tmp'];
    for (const f of [...stale, ...keep]) writeFileSync(join(dir, f), 'x');
    const r = cli(['build', 'g.csv', '--quiet'], dir);
    expect(r.code).toBeLessThan(2);
    const left = readdirSync(dir);
    for (const f of stale) expect(left).not.toContain(f);
    for (const f of keep) expect(left).toContain(f);
    expect(left).toContain('g.dxf');
  });

  it("removeOwnTemps takes this process's temp files only", () => {
    const dir = tempDir();
    mkdirSync(join(dir, 'a'));
    const mine = join(dir, 'a', `x.dxf.${process.pid}.abcdef01.tmp`);
    const other = join(dir, 'a', 'x.dxf.1.abcdef01.tmp');
    writeFileSync(mine, '');
    writeFileSync(other, '');
    removeOwnTemps([join(dir, 'a'), join(dir, 'missing')]);
    expect(existsSync(mine)).toBe(false);
    expect(existsSync(other)).toBe(true);
  });
});

describe('grids and options that once took minutes or crashed', () => {
  it('an all-solid 1 × 1 grid builds every output (the thickness picture once took 82 s)', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'one.csv'), '1\n');
    const r = cli(['build', 'one.csv', '--quiet'], dir);
    expect(r.code).toBe(0);
    expect(readdirSync(dir).sort()).toEqual(['one.csv', 'one.dxf', 'one.report.html', 'one.report.json', 'one.svg']);
  });

  it('a passive rect with max x = 5e-324: E_PASSIVE_FORMAT at that value, not E_INTERNAL', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'g.csv'), '0,0,0\n0,1,0\n0,0,0\n');
    writeFileSync(join(dir, 'p.json'), '{"rhoformPassive":1,"regions":[{"role":"solid","rect":{"min":[0,0],"max":[5e-324,1]}}]}');
    const r = cli(['build', 'g.csv', '--passive', 'p.json'], dir);
    oneCleanLine(r, 'E_PASSIVE_FORMAT');
    expect(r.stderr).toContain('p.json:1:');
  });

  it('a long-form CSV with y = 1e300: E_CSV_LONG at its line and column, not a usage error', () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'l.csv'), 'x,y,value\n0,0,1\n1,0,1\n0,1e300,1\n1,1e300,1\n');
    const r = cli(['build', 'l.csv'], dir);
    oneCleanLine(r, 'E_CSV_LONG');
    expect(r.stderr).toContain('l.csv:4:3: expected a y coordinate within ±1000000 mm, found 1e+300');
  });

  it('an NPY header with an ESC sequence is one line without the ESC', () => {
    const dir = tempDir();
    const h = "{'descr': '<\x1b[2J\x1b[31mf8', 'fortran_order': False, 'shape': (1, 1), }\n";
    const pre = Buffer.from([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0, h.length, 0]);
    writeFileSync(join(dir, 'e.npy'), Buffer.concat([pre, Buffer.from(h, 'latin1'), Buffer.alloc(8)]));
    const r = cli(['build', 'e.npy'], dir);
    oneCleanLine(r, 'E_NPY_DTYPE');
    expect(r.stderr).toContain('\\x1b[2J');
  });
});

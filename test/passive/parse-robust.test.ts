/**
 * Passive-region files that once crashed, echoed raw lines or got the wrong code (issue 11, items 2 and 5).
 * Positions are counted by hand from the written-out texts.
 */
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { parsePassive, parsePassiveBytes } from '../../src/passive/parse.js';
import { rhoformErrorOf } from '../support/errors.js';

function errorOf(f: () => unknown): RhoformError {
  return rhoformErrorOf(f, 'expected an error');
}
// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/;

describe('passive file: deep nesting, messages, tiny shapes, bytes', () => {
  it('5000 levels of nesting is E_PASSIVE_FORMAT at the first level too deep, not a stack overflow', () => {
    const text = '['.repeat(5000) + ']'.repeat(5000);
    const e = errorOf(() => parsePassive(text, 'deep.json'));
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    // levels 0 … 63 are followed; the 65th '[' (offset 64) is refused
    expect(e.where).toEqual({ file: 'deep.json', line: 1, col: 65 });
    expect(e.detail).toMatch(/^expected at most 64 levels of nested arrays and objects/);
  });

  it('deep nesting with a syntax error inside is refused the same way', () => {
    const e = errorOf(() => parsePassive('{"a":'.repeat(3000) + 'x', 'deep.json'));
    expect(['E_PASSIVE_FORMAT', 'E_PASSIVE_JSON']).toContain(e.code);
    expect(e.message).not.toMatch(CONTROL);
  });

  it("Node 20's echo of the text (…\"…\" is not valid JSON) never reaches the message; newlines never do", () => {
    const long = '{"aaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaaa": x, "bbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbbb": 1}';
    for (const text of ['{\n"a": x\n}', '{\n"rhoformPassive": x\n}\n', long, '{\n"rhoformPassive":tru\n}', 'undefined', 'nul\n', '{"a":\u0001}']) {
      const e = errorOf(() => parsePassive(text, 'p.json'));
      expect(e.code).toBe('E_PASSIVE_JSON');
      expect(e.message).not.toMatch(CONTROL);
      expect(e.message).not.toContain('is not valid JSON');
      expect(e.message).not.toContain('...');
      expect(e.where?.line).toBeGreaterThanOrEqual(1);
    }
    // hand count: "{\n"a": x\n}" — the x is on line 2, column 6
    expect(errorOf(() => parsePassive('{\n"a": x\n}', 'p.json')).where).toEqual({ file: 'p.json', line: 2, col: 6 });
  });

  it('a rect with max x = 5e-324 is E_PASSIVE_FORMAT at that value, not E_INTERNAL from the boolean engine', () => {
    const text = '{"rhoformPassive":1,"regions":[{"role":"solid","rect":{"min":[0,0],"max":[5e-324,1]}}]}';
    const e = errorOf(() => parsePassive(text, 'p.json'));
    expect(e.code).toBe('E_PASSIVE_FORMAT');
    expect(e.detail).toBe('regions[0].rect.max[0]: expected a width of at least 0.001 mm (max x − min x), found 5e-324');
    expect(e.where).toEqual({ file: 'p.json', line: 1, col: text.indexOf('5e-324') + 1 });
  });

  it('a circle of radius 1e-9 mm is refused at the radius', () => {
    const text = '{"rhoformPassive":1,"regions":[{"role":"void","circle":{"center":[1,1],"radius":1e-9}}]}';
    const e = errorOf(() => parsePassive(text, 'p.json'));
    expect([e.code, e.where]).toEqual(['E_PASSIVE_FORMAT', { file: 'p.json', line: 1, col: text.indexOf('1e-9') + 1 }]);
  });

  it('a file that is not UTF-8 names the byte offset of the first bad byte', () => {
    const good = new TextEncoder().encode('{"rhoformPassive":1,');
    const bytes = new Uint8Array([...good, 0xed, 0xa0, 0x80]); // an encoded surrogate: not UTF-8 (Unicode 3-7)
    const e = errorOf(() => parsePassiveBytes(bytes, 'p.json'));
    expect([e.code, e.where]).toEqual(['E_PASSIVE_JSON', { file: 'p.json', byteOffset: good.length }]);
    const e2 = errorOf(() => parsePassiveBytes(new Uint8Array([0x7b, 0xff]), 'p.json'));
    expect(e2.where).toEqual({ file: 'p.json', byteOffset: 1 });
  });
});

describe('the loads file shares the strict JSON reader, and its fixes', () => {
  it('deep nesting is E_LOADS_FORMAT at the first level too deep; Node 20 echoes stay out', async () => {
    const { parseLoads } = await import('../../src/loads/parse.js');
    const deep = errorOf(() => parseLoads('['.repeat(5000) + ']'.repeat(5000), 'l.json'));
    expect(deep.code).toBe('E_LOADS_FORMAT');
    expect(deep.where).toEqual({ file: 'l.json', line: 1, col: 65 });
    const syntax = errorOf(() => parseLoads('{\n"rhoformLoads": tru\n}', 'l.json'));
    expect(syntax.code).toBe('E_LOADS_JSON');
    expect(syntax.message).not.toMatch(CONTROL);
    expect(syntax.message).not.toContain('is not valid JSON');
  });
});

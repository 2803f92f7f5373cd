/**
 * Structure of the DXF we write, checked tag by tag against the DXF Reference rules summarised in
 * docs/references.md §7 (sections, handles, owners, LWPOLYLINE group codes) and for determinism.
 */
import { describe, expect, it } from 'vitest';
import { RhoformError } from '../../src/errors.js';
import { writeDxf } from '../../src/write/dxf.js';
import type { WriterInput } from '../../src/write/types.js';
import { dxfPairs, partRings, sampleInput } from './fixtures.js';

/** Splits the pairs into entities: every (0, TYPE) starts one. */
function entities(pairs: [number, string][]): { type: string; tags: [number, string][] }[] {
  const out: { type: string; tags: [number, string][] }[] = [];
  for (const [code, value] of pairs) {
    if (code === 0) out.push({ type: value, tags: [] });
    else out[out.length - 1]?.tags.push([code, value]);
  }
  return out;
}
const first = (tags: [number, string][], code: number): string | undefined => tags.find(([c]) => c === code)?.[1];

describe('DXF structure', () => {
  const text = writeDxf(sampleInput());
  const pairs = dxfPairs(text);

  it('is made of code/value line pairs with CRLF line ends and ends with 0/EOF', () => {
    // DXF Reference: a group code line, then a value line; the file ends with 0 EOF (docs/references.md §7.1).
    expect(text.endsWith('  0\r\nEOF\r\n')).toBe(true);
    expect(text.split('\r\n').length % 2).toBe(1); // even line count + the empty tail after the last CRLF
    expect(text.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    for (const [code] of pairs) expect(Number.isInteger(code) && code >= 0 && code <= 1071).toBe(true);
  });

  it('has the R2000 sections in order and $ACADVER AC1015', () => {
    // docs/references.md §7.1: R13+ needs HEADER, CLASSES, TABLES, BLOCKS, ENTITIES, OBJECTS.
    const sections = pairs.flatMap(([c, v], i) => (c === 0 && v === 'SECTION' ? [pairs[i + 1][1]] : []));
    expect(sections).toEqual(['HEADER', 'CLASSES', 'TABLES', 'BLOCKS', 'ENTITIES', 'OBJECTS']);
    const i = pairs.findIndex(([c, v]) => c === 9 && v === '$ACADVER');
    expect(pairs[i + 1]).toEqual([1, 'AC1015']);
  });

  it('has the required table records, blocks and root dictionary', () => {
    const ents = entities(pairs);
    const names = (type: string): string[] => ents.filter((e) => e.type === type).map((e) => first(e.tags, 2) ?? '');
    // docs/references.md §7.1 (ezdxf "Minimal DXF Content" for R13+)
    expect(names('VPORT')).toEqual(['*Active']);
    expect(names('LTYPE')).toEqual(['ByBlock', 'ByLayer', 'Continuous']);
    expect(names('LAYER')).toContain('0');
    expect(names('STYLE')).toEqual(['Standard']);
    expect(names('APPID')).toEqual(['ACAD']);
    expect(names('DIMSTYLE')).toEqual(['Standard']);
    expect(names('BLOCK_RECORD')).toEqual(['*Model_Space', '*Paper_Space']);
    expect(names('BLOCK')).toEqual(['*Model_Space', '*Paper_Space']);
    expect(ents.filter((e) => e.type === 'ENDBLK')).toHaveLength(2);
    const dicts = ents.filter((e) => e.type === 'DICTIONARY');
    expect(first(dicts[0].tags, 330)).toBe('0'); // the root dictionary is owned by nobody
    expect(first(dicts[0].tags, 3)).toBe('ACAD_GROUP');
  });

  it('gives every object a unique handle, every owner an existing handle, and $HANDSEED above them all', () => {
    // docs/references.md §7.1: entities carry handle (5; DIMSTYLE uses 105) and owner (330).
    const ents = entities(pairs).filter((e) => !['SECTION', 'ENDSEC', 'ENDTAB', 'EOF'].includes(e.type));
    const handles = ents.map((e) => first(e.tags, e.type === 'DIMSTYLE' ? 105 : 5));
    expect(handles.every((h) => h !== undefined && /^[0-9A-F]+$/.test(h))).toBe(true);
    expect(new Set(handles).size).toBe(handles.length);
    const known = new Set(handles);
    for (const e of ents) {
      const owner = first(e.tags, 330);
      expect(owner === '0' || (owner !== undefined && known.has(owner))).toBe(true);
    }
    const seedAt = pairs.findIndex(([c, v]) => c === 9 && v === '$HANDSEED');
    const seed = parseInt(pairs[seedAt + 1][1], 16);
    expect(Math.max(...handles.map((h) => parseInt(h ?? '0', 16)))).toBeLessThan(seed);
  });

  it('writes each ring as LWPOLYLINE with 90 = vertex count and 70 = 1, subclass markers and layer', () => {
    const input = sampleInput();
    const polylines = entities(pairs).filter((e) => e.type === 'LWPOLYLINE');
    const rings = partRings(input);
    rings.forEach(({ ring, hole }, k) => {
      const tags = polylines[k].tags;
      // docs/references.md §7.3 (DXF Reference, LWPOLYLINE): 100 AcDbPolyline, 90 vertex count, 70 bit 1 closed.
      expect(tags.filter(([c]) => c === 100).map(([, v]) => v)).toEqual(['AcDbEntity', 'AcDbPolyline']);
      expect(first(tags, 8)).toBe(hole ? 'hole' : 'outline');
      expect(Number(first(tags, 90))).toBe(ring.length);
      expect(Number(first(tags, 70))).toBe(1);
      expect(tags.filter(([c]) => c === 10)).toHaveLength(ring.length);
      expect(tags.filter(([c]) => c === 20)).toHaveLength(ring.length);
    });
  });

  it('formats numbers with at most 6 decimals, no exponent and no -0', () => {
    const numeric = pairs.filter(([c]) => (c >= 10 && c <= 59) || (c >= 140 && c <= 147));
    expect(numeric.length).toBeGreaterThan(100);
    for (const [, v] of numeric) expect(v).toMatch(/^-?(0|[1-9]\d*)(\.\d{0,5}[1-9])?$/);
    expect(numeric.some(([, v]) => v === '-0')).toBe(false);
  });
});

describe('DXF writer behaviour', () => {
  it('is deterministic: the same input gives identical text', () => {
    expect(writeDxf(sampleInput())).toBe(writeDxf(sampleInput()));
    expect(writeDxf(sampleInput('in'))).toBe(writeDxf(sampleInput('in')));
  });

  it('drops a repeated closing vertex and skips rings of fewer than 3 points', () => {
    const input: WriterInput = {
      polygons: {
        polygons: [
          { outer: [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]], holes: [[[1, 1], [2, 2]]] },
        ],
      },
      domain: [0, 0, 5, 5],
      units: 'mm',
    };
    const polylines = entities(dxfPairs(writeDxf(input))).filter((e) => e.type === 'LWPOLYLINE');
    expect(polylines).toHaveLength(1);
    expect(first(polylines[0].tags, 90)).toBe('4'); // common practice: closed flag, no repeated vertex
  });

  it('escapes labels: non-ASCII as \\U+XXXX, controls as spaces, %% pairs and backslashes', () => {
    const input: WriterInput = {
      polygons: { polygons: [] },
      domain: [0, 0, 10, 10],
      units: 'mm',
      extras: [{ layer: 'finding', markers: [{ x: 1, y: 1, label: 'Ø5\nmm %%d 5% a\\b' }] }],
    };
    const text = entities(dxfPairs(writeDxf(input))).find((e) => e.type === 'TEXT');
    // \U+XXXX is the form ezdxf's writer uses for characters outside the code page (ezdxf lldxf/encoding.py).
    expect(first(text?.tags ?? [], 1)).toBe('\\U+00D85 mm \\U+0025\\U+0025d 5% a\\U+005Cb');
  });

  it('rejects non-finite coordinates, a bad domain, a bad radius and unknown units', () => {
    const base: WriterInput = { polygons: { polygons: [] }, domain: [0, 0, 10, 10], units: 'mm' };
    const bad: WriterInput[] = [
      { ...base, polygons: { polygons: [{ outer: [[0, 0], [1, NaN], [1, 1]], holes: [] }] } },
      { ...base, domain: [0, 0, 0, 10] },
      { ...base, domain: [0, 0, NaN, 10] },
      { ...base, extras: [{ layer: 'passive', circles: [{ x: 1, y: 1, r: 0 }] }] },
      { ...base, units: 'cm' as unknown as 'mm' },
    ];
    for (const input of bad) expect(() => writeDxf(input)).toThrow(RhoformError);
  });

  it('does not mutate its input', () => {
    const input = sampleInput();
    const before = JSON.stringify(input);
    writeDxf(input);
    expect(JSON.stringify(input)).toBe(before);
  });
});

/**
 * SVG output read back with a tiny parser of our own: attributes by regular expression, path data by the
 * SVG 1.1 path grammar (§8.3: M/L/Z commands, implicit lineto after the first coordinate pair).
 */
import { describe, expect, it } from 'vitest';
import type { Point } from '../../src/types.js';
import { writeSvg } from '../../src/write/svg.js';
import type { WriterInput } from '../../src/write/types.js';
import { partRings, regularPolygon, sampleInput } from './fixtures.js';

/** Attributes of the first element `<name …>` whose attributes match `where`. */
function element(svg: string, name: string, where = ''): Record<string, string> {
  const re = new RegExp(`<${name}\\b([^>]*)>`, 'g');
  for (const m of svg.matchAll(re)) {
    if (!m[1].includes(where)) continue;
    const attrs: Record<string, string> = {};
    for (const a of m[1].matchAll(/([\w:-]+)="([^"]*)"/g)) attrs[a[1]] = a[2];
    return attrs;
  }
  throw new Error(`no <${name}> with ${where}`);
}

/** Parses absolute M/L/Z path data into closed rings (SVG 1.1 §8.3.2–8.3.4). */
function parsePath(d: string): Point[][] {
  const tokens = d.match(/[MLZ]|-?\d*\.?\d+/g) ?? [];
  const rings: Point[][] = [];
  let current: Point[] | null = null;
  for (let i = 0; i < tokens.length; ) {
    const t = tokens[i];
    if (t === 'M') {
      current = [];
      rings.push(current);
      i++;
    } else if (t === 'L') i++;
    else if (t === 'Z') {
      current = null;
      i++;
    } else {
      if (!current) throw new Error('coordinate outside a sub-path');
      current.push([Number(tokens[i]), Number(tokens[i + 1])]);
      i += 2;
    }
  }
  return rings;
}

const svgOf = (units: 'mm' | 'in'): string => writeSvg(sampleInput(units));

describe('SVG writer', () => {
  for (const units of ['mm', 'in'] as const) {
    const div = units === 'in' ? 25.4 : 1; // 1 in = 25.4 mm exactly (NIST SP 811)
    const decimals = units === 'in' ? 4 : 3;
    const tol = 0.5 * 10 ** -decimals + 1e-12;

    it(`has a physical page equal to the domain (${units})`, () => {
      const input = sampleInput(units);
      const [minX, minY, maxX, maxY] = input.domain;
      const svg = element(svgOf(units), 'svg');
      // docs/references.md §7.4: physical size via width/height with a unit plus a viewBox in the same unit.
      const width = svg.width.match(/^([\d.]+)(mm|in)$/);
      const height = svg.height.match(/^([\d.]+)(mm|in)$/);
      expect(width?.[2]).toBe(units);
      expect(height?.[2]).toBe(units);
      expect(Math.abs(Number(width?.[1]) * div - (maxX - minX))).toBeLessThanOrEqual(tol * div);
      expect(Math.abs(Number(height?.[1]) * div - (maxY - minY))).toBeLessThanOrEqual(tol * div);
      const box = svg.viewBox.split(' ').map(Number);
      expect(Math.abs(box[0] - minX / div)).toBeLessThanOrEqual(tol);
      expect(box[1]).toBe(0);
      expect(box[2]).toBe(Number(width?.[1]));
      expect(box[3]).toBe(Number(height?.[1]));
    });

    it(`holds every ring in one evenodd path, y flipped once (${units})`, () => {
      const input = sampleInput(units);
      const maxY = input.domain[3];
      const text = svgOf(units);
      expect(text.match(/<path id="part"/g)).toHaveLength(1);
      const part = element(text, 'path', 'id="part"');
      // docs/references.md §7.4 (MDN): evenodd makes nested rings holes regardless of winding.
      expect(part['fill-rule']).toBe('evenodd');
      const rings = parsePath(part.d);
      const expected = partRings(input);
      expect(rings).toHaveLength(expected.length);
      expected.forEach(({ ring }, k) => {
        expect(rings[k]).toHaveLength(ring.length);
        ring.forEach(([x, y], i) => {
          expect(Math.abs(rings[k][i][0] - x / div)).toBeLessThanOrEqual(tol);
          expect(Math.abs(rings[k][i][1] - (maxY - y) / div)).toBeLessThanOrEqual(tol); // y' = maxY − y
        });
      });
    });
  }

  it('has a title, a description, and groups with ids for the extra layers', () => {
    const text = svgOf('mm');
    expect(text).toMatch(/<title>[^<]+<\/title>/);
    expect(text).toMatch(/<desc>[^<]+<\/desc>/);
    for (const id of ['passive', 'repair', 'finding']) expect(text).toContain(`<g id="${id}"`);
    // passive circle at (85, 30) r 5 → cy = 70 − 30
    const circle = element(text, 'circle', 'cx="85"');
    expect(circle).toMatchObject({ cx: '85', cy: '40', r: '5' });
    // findings are numbered circle markers, drawn above the part
    expect(text.indexOf('<g id="finding"')).toBeGreaterThan(text.indexOf('<path id="part"'));
    expect(text.match(/<g class="marker">/g)).toHaveLength(3);
    expect(text).toContain('>1</text>');
  });

  it('escapes label text for XML', () => {
    const text = svgOf('mm');
    expect(text).toContain('2 &lt;thin&gt; &amp; &quot;sharp&quot;');
    expect(text).not.toContain('<thin>');
    const odd: WriterInput = {
      polygons: { polygons: [] },
      domain: [0, 0, 10, 10],
      units: 'mm',
      extras: [{ layer: 'finding', markers: [{ x: 1, y: 1, label: "a'b\u0001c" }] }],
    };
    expect(writeSvg(odd)).toContain('a&apos;b\uFFFDc'); // XML 1.0 §2.2 forbids U+0001
  });

  it('embeds an underlay below the part, and omits empty groups', () => {
    const input: WriterInput = {
      polygons: { polygons: [{ outer: regularPolygon(5, 5, 3, 6), holes: [] }] },
      domain: [0, 0, 10, 10],
      units: 'mm',
      svgUnderlay: '<rect x="0" y="0" width="10" height="10" fill="#eee"/>',
      extras: [{ layer: 'finding', markers: [] }, { layer: 'repair', rings: [[[1, 1], [2, 2]]] }],
    };
    const text = writeSvg(input);
    expect(text).toContain('<g id="underlay"><rect');
    expect(text.indexOf('id="underlay"')).toBeLessThan(text.indexOf('id="part"'));
    expect(text).not.toContain('id="finding"');
    expect(text).not.toContain('id="repair"'); // its only ring has 2 points and encloses nothing
  });

  it('is deterministic and does not mutate its input', () => {
    const input = sampleInput();
    const before = JSON.stringify(input);
    expect(writeSvg(input)).toBe(writeSvg(sampleInput()));
    expect(JSON.stringify(input)).toBe(before);
  });

  it('balances its tags (well-formed element nesting)', () => {
    const stack: string[] = [];
    for (const m of svgOf('mm').matchAll(/<(\/?)([\w:-]+)[^>]*?(\/?)>/g)) {
      if (m[3] === '/') continue;
      if (m[1] === '/') expect(stack.pop()).toBe(m[2]);
      else stack.push(m[2]);
    }
    expect(stack).toEqual([]);
  });
});

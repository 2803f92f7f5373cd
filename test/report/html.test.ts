import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { build } from '../../src/pipeline.js';
import { CAUTIONS } from '../../src/report/cautions.js';
import { escapeHtml, formatHtml } from '../../src/report/html.js';
import { resolveSettings } from '../../src/settings.js';

describe('HTML report', () => {
  const bytes = readFileSync(new URL('../../fixtures/grids/demo-bracket.npy', import.meta.url));
  const res = build({ name: 'demo-<bracket>.npy', bytes }, resolveSettings({ cellSize: [2, 2] }));
  const html = formatHtml(res.report, { outlineSvg: res.svg() });

  it('is one self-contained page: no network references, no scripts', () => {
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).not.toMatch(/(src|href)\s*=\s*"(https?:)?\/\//i);
    expect(html).not.toMatch(/<script/i);
    expect(html).toMatch(/<img alt="final outline" src="data:image\/svg\+xml;base64,/);
  });

  it('carries every caution, the threshold and the domain size', () => {
    for (const c of CAUTIONS) expect(html).toContain(escapeHtml(c));
    expect(html).toContain('240 × 120 mm domain'); // 120 × 60 cells of 2 mm
    expect(html).toContain('achieved (polygon area)');
  });

  it('escapes text from the input (file names are user data)', () => {
    expect(html).toContain('demo-&lt;bracket&gt;.npy');
    expect(html).not.toContain('demo-<bracket>.npy');
  });
});

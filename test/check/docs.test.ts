/**
 * Every registered check has its page docs/checks/<id>.md with a title naming the id and the five sections
 * (the doc page a check must ship with, as linters require of their rules). Fails when a page or a section
 * is missing or empty.
 */
import { describe, it, expect } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { CHECK_IDS } from '../../src/check/ids.js';

const DOCS = fileURLToPath(new URL('../../docs/checks/', import.meta.url));
const SECTIONS = ['What it measures', 'Method', 'Units and limit', 'Known limitations', 'References'] as const;

/** The `## ` sections of a Markdown page with their bodies (trimmed), in order. */
function sections(text: string): Map<string, string> {
  const out = new Map<string, string>();
  let name: string | null = null;
  let body: string[] = [];
  for (const line of text.split(/\r?\n/)) {
    const m = /^##\s+(.*?)\s*$/.exec(line);
    if (m && !line.startsWith('###')) {
      if (name !== null) out.set(name, body.join('\n').trim());
      name = m[1];
      body = [];
    } else if (name !== null) {
      body.push(line);
    }
  }
  if (name !== null) out.set(name, body.join('\n').trim());
  return out;
}

describe('docs/checks', () => {
  for (const id of CHECK_IDS) {
    describe(id, () => {
      const file = `${DOCS}${id}.md`;

      it('has its page', () => {
        expect(existsSync(file), `docs/checks/${id}.md is missing`).toBe(true);
      });

      it('names the id in its title line', () => {
        const first = readFileSync(file, 'utf8').split(/\r?\n/).find((l) => l.trim() !== '') ?? '';
        expect(first.startsWith('# ')).toBe(true);
        expect(first).toContain(id);
      });

      it('has each required section, not empty', () => {
        const s = sections(readFileSync(file, 'utf8'));
        for (const name of SECTIONS) {
          expect(s.has(name), `docs/checks/${id}.md lacks "## ${name}"`).toBe(true);
          expect(s.get(name)!.length, `docs/checks/${id}.md: "## ${name}" is empty`).toBeGreaterThan(0);
        }
      });
    });
  }

  it('the index lists every check', () => {
    const index = readFileSync(`${DOCS}README.md`, 'utf8');
    for (const id of CHECK_IDS) expect(index).toContain(`(${id}.md)`);
  });

  it('the section parser sees a missing or empty section', () => {
    const s = sections('# x\n\n## What it measures\n\nsomething\n\n## Method\n\n## References\n- a\n');
    expect(s.get('What it measures')).toBe('something');
    expect(s.get('Method')).toBe('');
    expect(s.has('Known limitations')).toBe(false);
  });
});

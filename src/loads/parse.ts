/**
 * The loads file (docs/structure.md): strict JSON like the passive file. Errors: E_LOADS_JSON, E_LOADS_FORMAT.
 *
 *   { "rhoformLoads": 1, "units": "mm", "material": { "E": 70000, "nu": 0.33 }, "thickness": 8,
 *     "interpolation": { "penal": 3, "minStiffness": 1e-9 },
 *     "supports": [ { "fix": "xy", "edge": "left" } ], "loads": [ { "force": [0, -1200], "point": [224, 30] } ] }
 */
import { RhoformError, show } from '../errors.js';
import { describe, parseStrictJson, whereOf, type StrictJson } from '../json/strict.js';
import { elementPath, memberPath } from '../json/scan.js';
import type { Point } from '../types.js';
import type { Edge, Fix, Load, LoadsSpec, Selector, Support } from './types.js';

/** Largest |coordinate| and radius, mm (1 km: beyond is a unit mistake). */
export const MAX_COORDINATE = 1e6;
/** Largest |force component|, N. */
export const MAX_FORCE = 1e12;
/** Modified SIMP defaults (Bendsøe & Sigmund 2003, Andreassen et al. 2011). */
export const DEFAULT_PENAL = 3;
export const DEFAULT_MIN_STIFFNESS = 1e-9;

const TOP_KEYS = ['rhoformLoads', 'units', 'material', 'thickness', 'interpolation', 'supports', 'loads'];
const SELECTORS = ['edge', 'point', 'segment', 'circle', 'rect'] as const;
const EDGES: readonly Edge[] = ['left', 'right', 'bottom', 'top'];
const FIXES: readonly Fix[] = ['x', 'y', 'xy'];

type Obj = Record<string, unknown>;

class Checker {
  constructor(
    private readonly json: StrictJson,
    private readonly file: string,
  ) {}

  fail(path: string, expected: string, found: string, opts: { key?: boolean; at?: string } = {}): never {
    const label = path === '' ? 'top level' : path;
    throw new RhoformError('E_LOADS_FORMAT', `${label}: expected ${expected}, found ${found}`, whereOf(this.json, this.file, opts.at ?? path, opts.key));
  }

  object(v: unknown, path: string, what: string, keys: readonly string[]): Obj {
    if (v === null || typeof v !== 'object' || Array.isArray(v)) this.fail(path, what, describe(v));
    const o = v as Obj;
    for (const k of Object.keys(o)) {
      if (!keys.includes(k)) this.fail(memberPath(path, k), `one of the keys ${keys.join(', ')}`, `the unknown key ${show(k)}`, { key: true });
    }
    return o;
  }

  /** JSON.parse turns 1e999 into Infinity: the message shows the source text. */
  number(v: unknown, path: string, what: string, limit = MAX_COORDINATE, unit = 'mm'): number {
    if (typeof v !== 'number') this.fail(path, what, describe(v));
    if (!Number.isFinite(v)) this.fail(path, 'a finite number', this.raw(path) ?? describe(v));
    if (!(Math.abs(v) <= limit)) this.fail(path, `a value within ±${limit} ${unit}`, describe(v));
    return v;
  }

  private raw(path: string): string | null {
    const spot = this.json.spots.get(path);
    if (!spot) return null;
    const m = /^-?[0-9.eE+-]+/.exec(this.json.text.slice(spot.value, spot.value + 64));
    return m ? m[0] : null;
  }

  point(v: unknown, path: string): Point {
    if (!Array.isArray(v) || v.length !== 2) this.fail(path, 'a point [x, y] in mm', describe(v));
    const a = v as unknown[];
    return [this.number(a[0], elementPath(path, 0), 'a number (x, mm)'), this.number(a[1], elementPath(path, 1), 'a number (y, mm)')];
  }

  selector(o: Obj, path: string): Selector {
    const present = SELECTORS.filter((k) => k in o);
    if (present.length !== 1) {
      const found = present.length === 0 ? 'none' : present.join(' and ');
      this.fail(path, `exactly one of the keys ${SELECTORS.join(', ')}`, found, present.length > 1 ? { at: memberPath(path, present[1]), key: true } : {});
    }
    const kind = present[0];
    const p = memberPath(path, kind);
    const v = o[kind];
    switch (kind) {
      case 'edge':
        if (typeof v !== 'string' || !EDGES.includes(v as Edge)) this.fail(p, `one of ${EDGES.map((e) => `"${e}"`).join(', ')}`, describe(v));
        return { kind, edge: v as Edge };
      case 'point':
        return { kind, at: this.point(v, p) };
      case 'segment': {
        if (!Array.isArray(v) || v.length !== 2) this.fail(p, 'a segment [[x0, y0], [x1, y1]] in mm', describe(v));
        const a = this.point((v as unknown[])[0], elementPath(p, 0));
        const b = this.point((v as unknown[])[1], elementPath(p, 1));
        if (a[0] === b[0] && a[1] === b[1]) this.fail(elementPath(p, 1), 'an end point different from the start point', `[${b[0]}, ${b[1]}] twice`);
        return { kind, a, b };
      }
      case 'circle': {
        const c = this.object(v, p, 'an object { "center": [x, y], "radius": r }', ['center', 'radius']);
        const center = this.point(c.center, memberPath(p, 'center'));
        const rp = memberPath(p, 'radius');
        const radius = this.number(c.radius, rp, 'a radius in mm');
        if (!(radius > 0)) this.fail(rp, 'a radius > 0 mm', describe(radius));
        return { kind, center, radius };
      }
      case 'rect': {
        const r = this.object(v, p, 'an object { "min": [x0, y0], "max": [x1, y1] }', ['min', 'max']);
        const min = this.point(r.min, memberPath(p, 'min'));
        const maxPath = memberPath(p, 'max');
        const max = this.point(r.max, maxPath);
        if (!(max[0] > min[0])) this.fail(elementPath(maxPath, 0), `a value greater than min x = ${min[0]}`, describe(max[0]));
        if (!(max[1] > min[1])) this.fail(elementPath(maxPath, 1), `a value greater than min y = ${min[1]}`, describe(max[1]));
        return { kind, min, max };
      }
    }
  }

  name(o: Obj, path: string): string | null {
    if (!('name' in o)) return null;
    if (typeof o.name !== 'string') this.fail(memberPath(path, 'name'), 'a string', describe(o.name));
    return o.name;
  }

  list(v: unknown, path: string, what: string): unknown[] {
    if (!Array.isArray(v)) this.fail(path, `an array of ${what}`, describe(v));
    if ((v as unknown[]).length === 0) this.fail(path, `at least one of ${what}`, 'an empty array');
    return v as unknown[];
  }

  at(path: string): { line?: number; col?: number } {
    const w = whereOf(this.json, this.file, path);
    return { line: w.line, col: w.col };
  }

  support(v: unknown, path: string): Support {
    const o = this.object(v, path, 'a support object { "fix": "x" | "y" | "xy", <selector>: … }', ['fix', ...SELECTORS, 'name']);
    if (typeof o.fix !== 'string' || !FIXES.includes(o.fix as Fix)) this.fail(memberPath(path, 'fix'), '"x", "y" or "xy"', describe(o.fix));
    const fix = o.fix as Fix;
    return { fix, selector: this.selector(o, path), name: this.name(o, path), path, ...this.at(path) };
  }

  load(v: unknown, path: string): Load {
    const o = this.object(v, path, 'a load object { "force": [Fx, Fy], <selector>: … }', ['force', ...SELECTORS, 'name']);
    const fp = memberPath(path, 'force');
    if (!Array.isArray(o.force) || o.force.length !== 2) this.fail(fp, 'a total force [Fx, Fy] in N', describe(o.force));
    const f = o.force as unknown[];
    const force: Point = [this.number(f[0], elementPath(fp, 0), 'a number (Fx, N)', MAX_FORCE, 'N'), this.number(f[1], elementPath(fp, 1), 'a number (Fy, N)', MAX_FORCE, 'N')];
    if (force[0] === 0 && force[1] === 0) this.fail(fp, 'a non-zero force', '[0, 0]');
    return { force, selector: this.selector(o, path), name: this.name(o, path), path, ...this.at(path) };
  }

  top(v: unknown, file: string): LoadsSpec {
    const o = this.object(v, '', 'an object { "rhoformLoads": 1, "material": …, "supports": […], "loads": […] }', TOP_KEYS);
    if (o.rhoformLoads !== 1) this.fail('rhoformLoads', '1 (the format version)', describe(o.rhoformLoads));
    if ('units' in o && o.units !== 'mm') this.fail('units', '"mm" (lengths in millimetres, forces in N, E in MPa; convert inches × 25.4)', describe(o.units));
    const m = this.object(o.material, 'material', 'an object { "E": MPa, "nu": Poisson\'s ratio }', ['E', 'nu']);
    const E = this.number(m.E, 'material.E', "Young's modulus in MPa", 1e9, 'MPa');
    if (!(E > 0)) this.fail('material.E', "Young's modulus > 0 MPa", describe(E));
    const nu = this.number(m.nu, 'material.nu', "Poisson's ratio", 1, '');
    if (!(nu > -1 && nu < 0.5)) this.fail('material.nu', "Poisson's ratio in (−1, 0.5) (plane stress)", describe(nu));
    let thickness: number | null = null;
    if ('thickness' in o) {
      thickness = this.number(o.thickness, 'thickness', 'a thickness in mm');
      if (!(thickness > 0)) this.fail('thickness', 'a thickness > 0 mm', describe(thickness));
    }
    let penal = DEFAULT_PENAL;
    let minStiffness = DEFAULT_MIN_STIFFNESS;
    if ('interpolation' in o) {
      const ip = this.object(o.interpolation, 'interpolation', 'an object { "penal": p, "minStiffness": r }', ['penal', 'minStiffness']);
      if ('penal' in ip) {
        penal = this.number(ip.penal, 'interpolation.penal', 'the SIMP penalty p', 100, '');
        if (!(penal >= 1)) this.fail('interpolation.penal', 'a penalty p ≥ 1', describe(penal));
      }
      if ('minStiffness' in ip) {
        minStiffness = this.number(ip.minStiffness, 'interpolation.minStiffness', 'the minimum stiffness ratio', 1, '');
        if (!(minStiffness > 0 && minStiffness < 1)) this.fail('interpolation.minStiffness', 'a ratio in (0, 1) (void must keep some stiffness)', describe(minStiffness));
      }
    }
    const supports = this.list(o.supports, 'supports', 'supports').map((s, k) => this.support(s, elementPath('supports', k)));
    const loads = this.list(o.loads, 'loads', 'loads').map((s, k) => this.load(s, elementPath('loads', k)));
    return { file, material: { E, nu }, thickness, interpolation: { penal, minStiffness }, supports, loads, supportsAt: this.at('supports') };
  }
}

/** mm, y up, N, MPa; `thickness` null when the file has none. Pure: the caller reads the file. */
export function parseLoads(text: string, file: string): LoadsSpec {
  const json = parseStrictJson(text, file, 'E_LOADS_JSON', 'E_LOADS_FORMAT');
  return new Checker(json, file).top(json.data, file);
}

/**
 * Parse a loads file from its bytes (the CLI reads them; the preview page embeds them). Throws RhoformError
 * E_LOADS_JSON for bytes that are not UTF-8, and what parseLoads throws.
 */
export function parseLoadsBytes(bytes: Uint8Array, file: string): LoadsSpec {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new RhoformError('E_LOADS_JSON', 'expected UTF-8 text (JSON), found bytes that are not UTF-8', { file });
  }
  return parseLoads(text, file);
}

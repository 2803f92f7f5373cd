/**
 * The passive-region file (docs/passive.md): strict JSON, mm, y up. Errors: E_PASSIVE_JSON at the syntax error,
 * E_PASSIVE_FORMAT `<key path>: expected …, found …` at the key or value.
 */
import { RhoformError, show, type Where } from '../errors.js';
import type { Point } from '../types.js';
import { describe, parseStrictJson } from '../json/strict.js';
import { firstInvalidUtf8 } from '../read/utf8.js';
import { elementPath, lineCol, memberPath, type JsonSpot } from '../json/scan.js';
import { absArea, allCollinear, dropRepeats, firstSelfIntersection } from './polygon-check.js';
import type { PassiveRegion, PassiveRegions, PassiveRole, PassiveShape } from './types.js';

/** Points of one polygon at most (the self-intersection test is quadratic in the worst case). */
export const MAX_POLYGON_POINTS = 10_000;
/** Largest |coordinate| and radius, mm (1 km: beyond is a unit mistake). */
export const MAX_COORDINATE = 1e6;
/** Smallest size and radius, mm (1 µm, common practice, no source): smaller vanishes in the boolean engine's grid. */
export const MIN_SIZE = 1e-3;

const TOP_KEYS = ['rhoformPassive', 'units', 'regions'] as const;
const REGION_KEYS = ['role', 'circle', 'rect', 'polygon', 'name'] as const;
const SHAPE_KEYS = ['circle', 'rect', 'polygon'] as const;

type Obj = Record<string, unknown>;

class Checker {
  private spots: ReadonlyMap<string, JsonSpot>;

  constructor(
    private readonly text: string,
    private readonly file: string,
    spots: ReadonlyMap<string, JsonSpot>,
  ) {
    this.spots = spots;
  }

  /** Where the value (with `key`, the key) at `path` sits, else the nearest enclosing value. */
  where(path: string, key = false): Where {
    let p = path;
    for (;;) {
      const spot = this.spots.get(p);
      if (spot) return { file: this.file, ...lineCol(this.text, key && spot.key !== undefined ? spot.key : spot.value) };
      if (p === '') return { file: this.file };
      const cut = Math.max(p.lastIndexOf('.'), p.lastIndexOf('['));
      p = cut < 0 ? '' : p.slice(0, cut);
      key = false;
    }
  }

  fail(path: string, expected: string, found: string, opts: { key?: boolean; at?: string } = {}): never {
    const label = path === '' ? 'top level' : path;
    throw new RhoformError('E_PASSIVE_FORMAT', `${label}: expected ${expected}, found ${found}`, this.where(opts.at ?? path, opts.key));
  }

  object(v: unknown, path: string, what: string, keys: readonly string[]): Obj {
    if (v === null || typeof v !== 'object' || Array.isArray(v)) this.fail(path, what, describe(v));
    const o = v as Obj;
    for (const k of Object.keys(o)) {
      if (!keys.includes(k)) {
        this.fail(memberPath(path, k), `one of the keys ${keys.join(', ')}`, `the unknown key ${show(k)}`, { key: true });
      }
    }
    return o;
  }

  number(v: unknown, path: string, what = 'a number'): number {
    if (typeof v !== 'number') this.fail(path, what, describe(v));
    if (!Number.isFinite(v)) this.fail(path, `a finite number`, this.raw(path) ?? describe(v));
    if (!(Math.abs(v) <= MAX_COORDINATE)) this.fail(path, `a value within ±${MAX_COORDINATE} mm`, describe(v));
    return v;
  }

  point(v: unknown, path: string): Point {
    if (!Array.isArray(v) || v.length !== 2) this.fail(path, 'a point [x, y] in mm', describe(v));
    const a = v as unknown[];
    return [this.number(a[0], elementPath(path, 0), 'a number (x, mm)'), this.number(a[1], elementPath(path, 1), 'a number (y, mm)')];
  }

  /** The source text of a number (JSON.parse turns overflow into Infinity). */
  private raw(path: string): string | null {
    const spot = this.spots.get(path);
    if (!spot) return null;
    const m = /^-?[0-9.eE+-]+/.exec(this.text.slice(spot.value, spot.value + 64));
    return m ? m[0] : null;
  }

  circle(v: unknown, path: string): PassiveShape {
    const o = this.object(v, path, 'an object { "center": [x, y], "radius": r }', ['center', 'radius']);
    const [cx, cy] = this.point(o.center, memberPath(path, 'center'));
    const rp = memberPath(path, 'radius');
    const r = this.number(o.radius, rp, 'a radius in mm');
    if (!(r > 0)) this.fail(rp, 'a radius > 0 mm', describe(r));
    if (!(r >= MIN_SIZE)) this.fail(rp, `a radius of at least ${MIN_SIZE} mm`, describe(r));
    return { kind: 'circle', cx, cy, r };
  }

  rect(v: unknown, path: string): PassiveShape {
    const o = this.object(v, path, 'an object { "min": [x0, y0], "max": [x1, y1] }', ['min', 'max']);
    const [x0, y0] = this.point(o.min, memberPath(path, 'min'));
    const maxPath = memberPath(path, 'max');
    const [x1, y1] = this.point(o.max, maxPath);
    if (!(x1 > x0)) this.fail(elementPath(maxPath, 0), `a value greater than min x = ${x0}`, describe(x1));
    if (!(y1 > y0)) this.fail(elementPath(maxPath, 1), `a value greater than min y = ${y0}`, describe(y1));
    if (!(x1 - x0 >= MIN_SIZE)) this.fail(elementPath(maxPath, 0), `a width of at least ${MIN_SIZE} mm (max x − min x)`, describe(x1));
    if (!(y1 - y0 >= MIN_SIZE)) this.fail(elementPath(maxPath, 1), `a height of at least ${MIN_SIZE} mm (max y − min y)`, describe(y1));
    return { kind: 'rect', x0, y0, x1, y1 };
  }

  polygon(v: unknown, path: string): PassiveShape {
    if (!Array.isArray(v)) this.fail(path, 'an array of points [[x, y], …]', describe(v));
    const a = v as unknown[];
    if (a.length > MAX_POLYGON_POINTS) this.fail(path, `at most ${MAX_POLYGON_POINTS} points`, `${a.length}`);
    const pts = a.map((p, k) => this.point(p, elementPath(path, k)));
    const { points, index } = dropRepeats(pts);
    if (points.length < 3) this.fail(path, 'at least 3 distinct points', `${points.length}`);
    if (allCollinear(points)) this.fail(path, 'a polygon of non-zero area', 'all points on one line');
    const hit = firstSelfIntersection(points);
    if (hit !== null) {
      const edge = (e: number): string => `${index[e]}–${index[(e + 1) % points.length]}`;
      this.fail(path, 'a simple polygon (edges neither cross nor touch)', `edge ${edge(hit[0])} crossing or touching edge ${edge(hit[1])} (point indices)`);
    }
    if (!(absArea(points) > 0)) this.fail(path, 'a polygon of non-zero area', 'area 0');
    return { kind: 'polygon', points };
  }

  region(v: unknown, path: string): PassiveRegion {
    const o = this.object(v, path, 'a region object { "role": …, "circle" | "rect" | "polygon": … }', REGION_KEYS);
    const rolePath = memberPath(path, 'role');
    if (o.role !== 'solid' && o.role !== 'void') this.fail(rolePath, '"solid" or "void"', describe(o.role));
    const role: PassiveRole = o.role;
    const present = SHAPE_KEYS.filter((k) => k in o);
    if (present.length !== 1) {
      const found = present.length === 0 ? 'none' : present.join(' and ');
      this.fail(path, 'exactly one of the keys circle, rect, polygon', found, present.length > 1 ? { at: memberPath(path, present[1]), key: true } : {});
    }
    const kind = present[0];
    const shapePath = memberPath(path, kind);
    const shape = kind === 'circle' ? this.circle(o[kind], shapePath) : kind === 'rect' ? this.rect(o[kind], shapePath) : this.polygon(o[kind], shapePath);
    let name: string | null = null;
    if ('name' in o) {
      if (typeof o.name !== 'string') this.fail(memberPath(path, 'name'), 'a string', describe(o.name));
      name = o.name;
    }
    return { role, shape, name, path };
  }

  top(v: unknown): PassiveRegions {
    const o = this.object(v, '', 'an object { "rhoformPassive": 1, "regions": […] }', TOP_KEYS);
    if (o.rhoformPassive !== 1) this.fail('rhoformPassive', '1 (the format version)', describe(o.rhoformPassive));
    if ('units' in o && o.units !== 'mm') {
      this.fail('units', '"mm" (coordinates are millimetres; convert inches × 25.4)', describe(o.units));
    }
    if (!Array.isArray(o.regions)) this.fail('regions', 'an array of regions', describe(o.regions));
    const list = o.regions as unknown[];
    return { regions: list.map((r, k) => this.region(r, elementPath('regions', k))) };
  }
}

/** UTF-8 (BOM allowed), else E_PASSIVE_JSON at the first bad byte; then parsePassive. */
export function parsePassiveBytes(bytes: Uint8Array, file: string): PassiveRegions {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    const at = Math.max(0, firstInvalidUtf8(bytes));
    throw new RhoformError('E_PASSIVE_JSON', `expected UTF-8 text (JSON), found the byte 0x${bytes[at].toString(16).padStart(2, '0')} that is not UTF-8`, {
      file,
      byteOffset: at,
    });
  }
  return parsePassive(text, file);
}

/** Regions in mm, y up, in file order. Pure: the caller reads the file. */
export function parsePassive(text: string, file: string): PassiveRegions {
  const json = parseStrictJson(text, file, 'E_PASSIVE_JSON', 'E_PASSIVE_FORMAT');
  return new Checker(json.text, file, json.spots).top(json.data);
}

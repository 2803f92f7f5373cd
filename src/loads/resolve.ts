/**
 * The load case on the grid's nodes: fixed dofs and nodal forces. Node (i, j) at (x0 + i·hx, y0 + j·hy), mm, y up;
 * dof 2n is u, 2n + 1 is v of node n = j·(ex + 1) + i. Selectors and force shares: docs/notes/loads.md.
 */
import { RhoformError, type Where } from '../errors.js';
import { atan2 } from '../geom/portable-math.js';
import type { Point } from '../types.js';
import type { Load, LoadsSpec, Selector, Support } from './types.js';
import { hypot } from '../geom/portable-math.js';

/** ex × ey elements of hx × hy mm, lower-left corner (x0, y0). */
export interface FeGrid {
  readonly ex: number;
  readonly ey: number;
  readonly hx: number;
  readonly hy: number;
  readonly x0?: number;
  readonly y0?: number;
}

export interface ResolvedEntry {
  readonly path: string;
  readonly name: string | null;
  readonly nodes: number;
  /** Node ids n = j·(ex + 1) + i. */
  readonly nodeIds: readonly number[];
  /** Loads: the force (N) that fell on fixed dofs and goes to the support. */
  readonly toSupport?: Point;
}

export interface ResolvedLoadCase {
  /** Length 2·(ex + 1)·(ey + 1). */
  readonly fixed: Uint8Array;
  /** N, zero on fixed dofs. */
  readonly force: Float64Array;
  readonly supports: readonly ResolvedEntry[];
  readonly loads: readonly ResolvedEntry[];
}

/** `supports[2] ("bolt, left")` */
export function entryLabel(e: { path: string; name: string | null }): string {
  return e.name === null ? e.path : `${e.path} (${JSON.stringify(e.name)})`;
}

function fail(spec: LoadsSpec, e: Support | Load, detail: string): never {
  const where: Where = e.line !== undefined ? { file: spec.file, line: e.line, col: e.col } : { file: spec.file };
  throw new RhoformError('E_LOADS_CASE', `${entryLabel(e)}: ${detail}`, where);
}

/** Caught nodes and each one's share of the force (weights sum to 1). */
interface Caught {
  nodes: number[];
  weights: number[];
}

/** Hat-function weights of positions s on a line of length len, lumped ends; they sum to 1. */
function lineWeights(s: number[], len: number, periodic: boolean): number[] {
  const order = s.map((_, k) => k).sort((a, b) => s[a] - s[b]);
  const n = order.length;
  const w = new Array<number>(n).fill(0);
  if (n === 1) {
    w[0] = 1;
    return w;
  }
  for (let r = 0; r < n; r++) {
    const k = order[r];
    let prev: number;
    let next: number;
    if (periodic) {
      prev = r > 0 ? s[order[r - 1]] : s[order[n - 1]] - len;
      next = r < n - 1 ? s[order[r + 1]] : s[order[0]] + len;
      w[k] = (next - prev) / 2 / len;
    } else {
      prev = r > 0 ? s[order[r - 1]] : -s[k]; // the stretch before the first node is lumped onto it
      next = r < n - 1 ? s[order[r + 1]] : 2 * len - s[k];
      w[k] = (next - prev) / 2 / len;
    }
  }
  return w;
}

function select(sel: Selector, g: Required<FeGrid>): Caught {
  const { ex, ey, hx, hy, x0, y0 } = g;
  const nx = ex + 1;
  const half = 0.5 * Math.max(hx, hy) * (1 + 1e-9);
  const nodes: number[] = [];
  const s: number[] = [];
  // candidate node index ranges for a bounding box (mm), clipped to the grid
  const range = (xa: number, xb: number, ya: number, yb: number): [number, number, number, number] => [
    Math.max(0, Math.ceil((xa - x0) / hx - 1e-9)),
    Math.min(ex, Math.floor((xb - x0) / hx + 1e-9)),
    Math.max(0, Math.ceil((ya - y0) / hy - 1e-9)),
    Math.min(ey, Math.floor((yb - y0) / hy + 1e-9)),
  ];
  switch (sel.kind) {
    case 'edge': {
      const along = sel.edge === 'left' || sel.edge === 'right' ? ey : ex;
      for (let k = 0; k <= along; k++) {
        const i = sel.edge === 'left' ? 0 : sel.edge === 'right' ? ex : k;
        const j = sel.edge === 'bottom' ? 0 : sel.edge === 'top' ? ey : k;
        nodes.push(j * nx + i);
        s.push(k);
      }
      return { nodes, weights: lineWeights(s, along, false) };
    }
    case 'point': {
      const i = Math.min(ex, Math.max(0, Math.round((sel.at[0] - x0) / hx)));
      const j = Math.min(ey, Math.max(0, Math.round((sel.at[1] - y0) / hy)));
      return { nodes: [j * nx + i], weights: [1] };
    }
    case 'segment': {
      const [ax, ay] = sel.a;
      const [bx, by] = sel.b;
      const dx = bx - ax;
      const dy = by - ay;
      const len = hypot(dx, dy);
      const [i0, i1, j0, j1] = range(Math.min(ax, bx) - half, Math.max(ax, bx) + half, Math.min(ay, by) - half, Math.max(ay, by) + half);
      for (let j = j0; j <= j1; j++) {
        for (let i = i0; i <= i1; i++) {
          const px = x0 + i * hx - ax;
          const py = y0 + j * hy - ay;
          const t = Math.min(1, Math.max(0, (px * dx + py * dy) / (len * len)));
          if (hypot(px - t * dx, py - t * dy) <= half) {
            nodes.push(j * nx + i);
            s.push(t * len);
          }
        }
      }
      return { nodes, weights: nodes.length ? lineWeights(s, len, false) : [] };
    }
    case 'circle': {
      const [cx, cy] = sel.center;
      const R = sel.radius;
      const [i0, i1, j0, j1] = range(cx - R - half, cx + R + half, cy - R - half, cy + R + half);
      for (let j = j0; j <= j1; j++) {
        for (let i = i0; i <= i1; i++) {
          const px = x0 + i * hx - cx;
          const py = y0 + j * hy - cy;
          if (Math.abs(hypot(px, py) - R) <= half) {
            nodes.push(j * nx + i);
            s.push(R * atan2(py, px)); // the same bits in every engine (geom/portable-math.ts)
          }
        }
      }
      return { nodes, weights: nodes.length ? lineWeights(s, 2 * Math.PI * R, true) : [] };
    }
    case 'rect': {
      const [i0, i1, j0, j1] = range(sel.min[0], sel.max[0], sel.min[1], sel.max[1]);
      for (let j = j0; j <= j1; j++) for (let i = i0; i <= i1; i++) nodes.push(j * nx + i);
      return { nodes, weights: nodes.map(() => 1 / nodes.length) };
    }
  }
}

/** Why a selector lies outside the domain beyond half a cell, or null. */
function outside(sel: Selector, g: Required<FeGrid>): string | null {
  const half = 0.5 * Math.max(g.hx, g.hy);
  const X1 = g.x0 + g.ex * g.hx;
  const Y1 = g.y0 + g.ey * g.hy;
  const dom = `the domain x ${g.x0}…${X1}, y ${g.y0}…${Y1} mm`;
  const inside = (p: Point): boolean => p[0] >= g.x0 - half && p[0] <= X1 + half && p[1] >= g.y0 - half && p[1] <= Y1 + half;
  const show = (p: Point): string => `[${p[0]}, ${p[1]}]`;
  switch (sel.kind) {
    case 'edge':
      return null;
    case 'point':
      return inside(sel.at) ? null : `the point ${show(sel.at)} lies outside ${dom}`;
    case 'segment':
      if (!inside(sel.a)) return `the segment's start ${show(sel.a)} lies outside ${dom}`;
      if (!inside(sel.b)) return `the segment's end ${show(sel.b)} lies outside ${dom}`;
      return null;
    case 'circle': {
      const { center: c, radius: r } = sel;
      return c[0] + r < g.x0 - half || c[0] - r > X1 + half || c[1] + r < g.y0 - half || c[1] - r > Y1 + half ? `the circle around ${show(c)} (r ${r} mm) lies outside ${dom}` : null;
    }
    case 'rect':
      return sel.max[0] < g.x0 - half || sel.min[0] > X1 + half || sel.max[1] < g.y0 - half || sel.min[1] > Y1 + half
        ? `the rect ${show(sel.min)}…${show(sel.max)} lies outside ${dom}`
        : null;
  }
}

/** Throws E_LOADS_CASE naming the entry when a selector lies outside the domain or catches no node. */
export function resolveLoadCase(spec: LoadsSpec, grid: FeGrid): ResolvedLoadCase {
  const g: Required<FeGrid> = { x0: 0, y0: 0, ...grid };
  const N = (g.ex + 1) * (g.ey + 1);
  const fixed = new Uint8Array(2 * N);
  const force = new Float64Array(2 * N);
  const caught = (e: Support | Load): Caught => {
    const why = outside(e.selector, g);
    if (why !== null) fail(spec, e, why);
    const c = select(e.selector, g);
    if (c.nodes.length === 0) fail(spec, e, `the ${e.selector.kind} catches no node of the grid (nodes every ${g.hx} × ${g.hy} mm; a segment or rim catches nodes within half a cell, a rect the nodes inside it)`);
    return c;
  };
  const supports = spec.supports.map((e) => {
    const c = caught(e);
    for (const n of c.nodes) {
      if (e.fix !== 'y') fixed[2 * n] = 1;
      if (e.fix !== 'x') fixed[2 * n + 1] = 1;
    }
    return { path: e.path, name: e.name, nodes: c.nodes.length, nodeIds: c.nodes };
  });
  const loads = spec.loads.map((e) => {
    const c = caught(e);
    let sx = 0;
    let sy = 0;
    for (let k = 0; k < c.nodes.length; k++) {
      const n = c.nodes[k];
      const fx = e.force[0] * c.weights[k];
      const fy = e.force[1] * c.weights[k];
      if (fixed[2 * n]) sx += fx;
      else force[2 * n] += fx;
      if (fixed[2 * n + 1]) sy += fy;
      else force[2 * n + 1] += fy;
    }
    return { path: e.path, name: e.name, nodes: c.nodes.length, nodeIds: c.nodes, toSupport: [sx, sy] as Point };
  });
  return { fixed, force, supports, loads };
}

/** Flat ring storage, segment predicates and a uniform grid of segments. mm, y up; rings implicitly closed. */

export interface FlatRings {
  /** Interleaved x, y, mm. */
  readonly xy: Float64Array;
  /** Ring r uses vertices start[r] … start[r+1]−1; length = rings + 1. */
  readonly start: Int32Array;
}

/** mm². */
export function sqSegDist(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  let dx = bx - ax;
  let dy = by - ay;
  let x = ax;
  let y = ay;
  if (dx !== 0 || dy !== 0) {
    const t = ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy);
    if (t > 1) {
      x = bx;
      y = by;
    } else if (t > 0) {
      x += dx * t;
      y += dy * t;
    }
  }
  dx = px - x;
  dy = py - y;
  return dx * dx + dy * dy;
}

/** Twice the signed area of triangle a, b, c (> 0 counter-clockwise). */
export function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

function onSegment(ax: number, ay: number, bx: number, by: number, px: number, py: number): boolean {
  return (
    Math.min(ax, bx) <= px && px <= Math.max(ax, bx) && Math.min(ay, by) <= py && py <= Math.max(ay, by)
  );
}

/** Whether the closed segments share a point; plain float orientation tests, conservative at zero. */
export function segmentsIntersect(
  p1x: number, p1y: number, p2x: number, p2y: number,
  q1x: number, q1y: number, q2x: number, q2y: number,
): boolean {
  if (Math.max(p1x, p2x) < Math.min(q1x, q2x) || Math.max(q1x, q2x) < Math.min(p1x, p2x)) return false;
  if (Math.max(p1y, p2y) < Math.min(q1y, q2y) || Math.max(q1y, q2y) < Math.min(p1y, p2y)) return false;
  const d1 = orient(q1x, q1y, q2x, q2y, p1x, p1y);
  const d2 = orient(q1x, q1y, q2x, q2y, p2x, p2y);
  const d3 = orient(p1x, p1y, p2x, p2y, q1x, q1y);
  const d4 = orient(p1x, p1y, p2x, p2y, q2x, q2y);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  if (d1 === 0 && onSegment(q1x, q1y, q2x, q2y, p1x, p1y)) return true;
  if (d2 === 0 && onSegment(q1x, q1y, q2x, q2y, p2x, p2y)) return true;
  if (d3 === 0 && onSegment(p1x, p1y, p2x, p2y, q1x, q1y)) return true;
  if (d4 === 0 && onSegment(p1x, p1y, p2x, p2y, q2x, q2y)) return true;
  return false;
}

/** Bucket grid: each segment in every cell its line passes, counting-sorted into rows, O(segments + cells). */
export class SegmentGrid {
  readonly minX: number;
  readonly minY: number;
  /** Cell size, mm. */
  readonly cs: number;
  readonly cols: number;
  readonly rows: number;
  readonly cellStart: Int32Array;
  readonly items: Int32Array;

  constructor(
    readonly x0: Float64Array, readonly y0: Float64Array,
    readonly x1: Float64Array, readonly y1: Float64Array,
    cellSize: number,
  ) {
    const n = x0.length;
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (let s = 0; s < n; s++) {
      minX = Math.min(minX, x0[s], x1[s]); maxX = Math.max(maxX, x0[s], x1[s]);
      minY = Math.min(minY, y0[s], y1[s]); maxY = Math.max(maxY, y0[s], y1[s]);
    }
    if (n === 0) { minX = minY = 0; maxX = maxY = 1; }
    let cs = cellSize > 0 && Number.isFinite(cellSize) ? cellSize : 1;
    const w = Math.max(maxX - minX, 1e-12), h = Math.max(maxY - minY, 1e-12);
    // cell count near the segment count: memory O(segments)
    const maxCells = 4 * n + 1024;
    if ((w / cs + 1) * (h / cs + 1) > maxCells) cs = Math.sqrt((w * h) / maxCells) * 1.05 + 1e-12;
    this.minX = minX; this.minY = minY; this.cs = cs;
    this.cols = Math.max(1, Math.floor(w / cs) + 1);
    this.rows = Math.max(1, Math.floor(h / cs) + 1);
    const counts = new Int32Array(this.cols * this.rows + 1);
    this.visit((cell) => { counts[cell + 1]++; }, n);
    for (let c = 1; c < counts.length; c++) counts[c] += counts[c - 1];
    const fill = counts.slice(0, counts.length - 1);
    const items = new Int32Array(counts[counts.length - 1]);
    this.visit((cell, s) => { items[fill[cell]++] = s; }, n);
    this.cellStart = counts;
    this.items = items;
  }

  col(x: number): number {
    const c = Math.floor((x - this.minX) / this.cs);
    return c < 0 ? 0 : c >= this.cols ? this.cols - 1 : c;
  }

  row(y: number): number {
    const r = Math.floor((y - this.minY) / this.cs);
    return r < 0 ? 0 : r >= this.rows ? this.rows - 1 : r;
  }

  private visit(fn: (cell: number, s: number) => void, n: number): void {
    const { x0, y0, x1, y1, cs, minX } = this;
    const pad = cs * 1e-9;
    for (let s = 0; s < n; s++) {
      let ax = x0[s], ay = y0[s], bx = x1[s], by = y1[s];
      if (ax > bx) { const tx = ax; ax = bx; bx = tx; const ty = ay; ay = by; by = ty; }
      const c0 = this.col(ax), c1 = this.col(bx);
      const slope = bx > ax ? (by - ay) / (bx - ax) : 0;
      for (let c = c0; c <= c1; c++) {
        let ya = ay, yb = by;
        if (c0 !== c1) {
          const xa = Math.max(ax, minX + c * cs), xb = Math.min(bx, minX + (c + 1) * cs);
          ya = ay + slope * (xa - ax);
          yb = ay + slope * (xb - ax);
        }
        const r0 = this.row(Math.min(ya, yb) - pad), r1 = this.row(Math.max(ya, yb) + pad);
        for (let r = r0; r <= r1; r++) fn(r * this.cols + c, s);
      }
    }
  }
}

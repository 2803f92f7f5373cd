/** Arcs by end points and bulge b = tan(θ/4), as DXF group 42 stores them; formulas: docs/notes/geom.md. mm, y up. */
import { hypot } from './portable-math.js';

/** Radians, 0 ≤ θ < 2π. */
export function bulgeAngle(b: number): number {
  return 4 * Math.atan(Math.abs(b));
}

/** Radius (mm) over a chord of c mm; Infinity for b = 0. */
export function bulgeRadius(c: number, b: number): number {
  return b === 0 ? Infinity : (c * (1 + b * b)) / (4 * Math.abs(b));
}

/** Signed area (mm²) between the arc and its chord: what replacing the chord adds to a ring's signed area. */
export function bulgeSegmentArea(c: number, b: number): number {
  if (b === 0 || c === 0) return 0;
  const t = bulgeAngle(b);
  const r = bulgeRadius(c, b);
  return Math.sign(b) * 0.5 * r * r * (t - Math.sin(t));
}

/** Arc length (mm) over a chord of c mm; c itself for b = 0. */
export function bulgeArcLength(c: number, b: number): number {
  if (b === 0 || c === 0) return c;
  return bulgeRadius(c, b) * bulgeAngle(b);
}

/** On the chord's left for b > 0. */
export function bulgeCentre(ax: number, ay: number, bx: number, by: number, b: number): [number, number] {
  const dx = bx - ax;
  const dy = by - ay;
  // offset along the left normal from the chord midpoint: (c/2)·(1 − b²)/(2b)
  const k = (1 - b * b) / (4 * b);
  return [(ax + bx) / 2 - k * dy, (ay + by) / 2 + k * dx];
}

/** Grows `box` [minX, minY, maxX, maxY] (mutated) by the arc's end points and the axis extremes it passes. */
export function extendByArc(box: number[], ax: number, ay: number, bx: number, by: number, b: number): void {
  const grow = (x: number, y: number) => {
    if (x < box[0]) box[0] = x;
    if (y < box[1]) box[1] = y;
    if (x > box[2]) box[2] = x;
    if (y > box[3]) box[3] = y;
  };
  grow(ax, ay);
  grow(bx, by);
  if (b === 0) return;
  const [cx, cy] = bulgeCentre(ax, ay, bx, by, b);
  const r = hypot(ax - cx, ay - cy);
  const a0 = b > 0 ? Math.atan2(ay - cy, ax - cx) : Math.atan2(by - cy, bx - cx);
  const sweep = bulgeAngle(b);
  for (let q = 0; q < 4; q++) {
    const ang = (q * Math.PI) / 2;
    let d = (ang - a0) % (2 * Math.PI);
    if (d < 0) d += 2 * Math.PI;
    if (d <= sweep) grow(cx + r * Math.cos(ang), cy + r * Math.sin(ang));
  }
}

/** Per polygon, per ring (0 outer, k ≥ 1 hole k − 1): one bulge per edge i → i + 1, or null for straight edges. */
export type RingBulges = readonly (readonly (readonly number[] | null)[])[];

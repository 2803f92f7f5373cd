/**
 * Circular arcs given by their end points and a bulge, as DXF stores them (LWPOLYLINE group 42, POLYLINE VERTEX
 * group 42; DXF Reference): bulge b = tan(θ/4), θ the included angle of the arc, b > 0 counter-clockwise from
 * the start to the end point, b < 0 clockwise, 0 straight; |b| = 1 is a half circle. Lengths in mm, y up.
 *
 * With c the chord length: radius r = c(1 + b²)/(4|b|), sagitta s = |b|·c/2, arc length r·θ, and the
 * circular segment between arc and chord has area r²(θ − sin θ)/2 (analytic). The segment lies to the right
 * of the chord's direction for b > 0 (the centre is to the left), so replacing a chord of any ring by the arc
 * adds sign(b)·segment to the ring's signed area (½∮ x dy − y dx over the arc and back along the chord).
 */

/** Included angle θ (radians, 0 ≤ θ < 2π) of an arc of bulge b. */
export function bulgeAngle(b: number): number {
  return 4 * Math.atan(Math.abs(b));
}

/** Radius (mm) of an arc of bulge b ≠ 0 over a chord of length c (mm); Infinity for b = 0. */
export function bulgeRadius(c: number, b: number): number {
  return b === 0 ? Infinity : (c * (1 + b * b)) / (4 * Math.abs(b));
}

/** Signed area (mm²) between the arc of bulge b over a chord of length c and the chord (see the header). */
export function bulgeSegmentArea(c: number, b: number): number {
  if (b === 0 || c === 0) return 0;
  const t = bulgeAngle(b);
  const r = bulgeRadius(c, b);
  return Math.sign(b) * 0.5 * r * r * (t - Math.sin(t));
}

/** Length (mm) of the arc of bulge b over a chord of length c; c itself for b = 0. */
export function bulgeArcLength(c: number, b: number): number {
  if (b === 0 || c === 0) return c;
  return bulgeRadius(c, b) * bulgeAngle(b);
}

/** Centre of the arc of bulge b ≠ 0 from (ax, ay) to (bx, by): on the chord's left for b > 0. */
export function bulgeCentre(ax: number, ay: number, bx: number, by: number, b: number): [number, number] {
  const dx = bx - ax;
  const dy = by - ay;
  // distance of the centre from the chord midpoint, along the left normal: (c/2)·(1 − b²)/(2b)
  const k = (1 - b * b) / (4 * b);
  return [(ax + bx) / 2 - k * dy, (ay + by) / 2 + k * dx];
}

/**
 * Extends the box [minX, minY, maxX, maxY] (mutated) by the arc of bulge b from (ax, ay) to (bx, by): its end
 * points and every axis extreme (0°, 90°, 180°, 270°) the arc passes.
 */
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
  const r = Math.hypot(ax - cx, ay - cy);
  // walk counter-clockwise from the start angle by θ (for b < 0, from the end point instead)
  const a0 = b > 0 ? Math.atan2(ay - cy, ax - cx) : Math.atan2(by - cy, bx - cx);
  const sweep = bulgeAngle(b);
  for (let q = 0; q < 4; q++) {
    const ang = (q * Math.PI) / 2;
    let d = (ang - a0) % (2 * Math.PI);
    if (d < 0) d += 2 * Math.PI;
    if (d <= sweep) grow(cx + r * Math.cos(ang), cy + r * Math.sin(ang));
  }
}

/**
 * Circular arcs of the part's rings (`--arcs`): for polygon p and ring k (0 = outer, k ≥ 1 = hole k − 1), one
 * bulge per edge of the ring as given — bulge i belongs to the edge from point i to point i + 1 (mod n) — or
 * null for a ring of straight edges (DXF group 42).
 */
export type RingBulges = readonly (readonly (readonly number[] | null)[])[];

/**
 * Marching-squares case logic shared by the contour and the area functions: which corners are solid,
 * where an edge is crossed, and how a saddle cell is resolved.
 *
 * Marching squares: W.E. Lorensen, H.E. Cline, "Marching Cubes: A High Resolution 3D Surface Construction
 * Algorithm", Computer Graphics (SIGGRAPH '87) 21(4):163–170, 1987, DOI 10.1145/37401.37422.
 * Asymptotic decider: G.M. Nielson, B. Hamann, "The asymptotic decider: resolving the ambiguity in marching
 * cubes", Proc. IEEE Visualization '91, pp. 83–91, 1991, DOI 10.1109/VISUAL.1991.175782.
 */

/**
 * How a saddle cell (two diagonally opposite solid corners, the other two void) is resolved:
 * - 'decider': asymptotic decider (Nielson & Hamann 1991): the solid corners are joined through the cell when
 *   the value of the bilinear interpolant at the crossing of its asymptotes,
 *   (B00·B11 − B10·B01) / (B00 + B11 − B10 − B01), is ≥ the level;
 * - 'join': always join the solid corners (solid is 8-connected, void 4-connected);
 * - 'split': never (solid 4-connected, void 8-connected — the choice of d3-contour).
 */
export type SaddleRule = 'decider' | 'join' | 'split';

/** The saddle rules, for validation and documentation. */
export const SADDLE_RULES: readonly SaddleRule[] = ['decider', 'join', 'split'];

/**
 * True when the two solid corners s1, s2 of a saddle cell are joined through the cell (the void corners
 * v1, v2 then each get their own cut). For 'decider' this is the sign test equivalent to
 * "saddle value ≥ level": (s1 − L)(s2 − L) ≥ (v1 − L)(v2 − L), i.e. Q = (B00−L)(B11−L) − (B10−L)(B01−L)
 * has the sign of B00 + B11 − B10 − B01 (or is 0). Solid corners are ≥ L, void corners < L.
 */
export function joinsSolid(s1: number, s2: number, v1: number, v2: number, level: number, rule: SaddleRule): boolean {
  if (rule === 'join') return true;
  if (rule === 'split') return false;
  return (s1 - level) * (s2 - level) >= (v1 - level) * (v2 - level);
}

/**
 * Fraction of the way from a solid end (value vs ≥ L) to a void end (vq < L) where the linear interpolant
 * equals L: (L − vs)/(vq − vs), in [0, 1). Measured from the solid end so that a void end at −∞ (NaN, or
 * outside the domain) puts the crossing exactly on the solid end.
 */
export function crossing(vs: number, vq: number, level: number): number {
  return (level - vs) / (vq - vs);
}

/**
 * Case index of a cell from its corner flags (1 = solid): bottom-left | bottom-right << 1 | top-right << 2 |
 * top-left << 3 (counter-clockwise). Cases 5 and 10 are the saddles. Edges are numbered counter-clockwise
 * too: 0 bottom (bl→br), 1 right (br→tr), 2 top (tr→tl), 3 left (tl→bl).
 *
 * For a non-saddle case the boundary segment runs from the "exit" edge (solid → void going counter-clockwise
 * round the cell) to the "entry" edge (void → solid), which keeps the solid on its left: outer rings come out
 * counter-clockwise and holes clockwise.
 */
export const EXIT_EDGE: Int8Array = makeTable(true);
export const ENTRY_EDGE: Int8Array = makeTable(false);

function makeTable(exit: boolean): Int8Array {
  const t = new Int8Array(16).fill(-1);
  for (let c = 1; c < 15; c++) {
    if (c === 5 || c === 10) continue;
    for (let k = 0; k < 4; k++) {
      const a = (c >> k) & 1;
      const b = (c >> ((k + 1) & 3)) & 1;
      if (exit ? a === 1 && b === 0 : a === 0 && b === 1) t[c] = k;
    }
  }
  return t;
}

/**
 * Marching-squares case logic shared by the contour and the area functions.
 *
 * Marching squares: W.E. Lorensen, H.E. Cline, "Marching Cubes: A High Resolution 3D Surface Construction
 * Algorithm", Computer Graphics (SIGGRAPH '87) 21(4):163–170, 1987, DOI 10.1145/37401.37422.
 * Asymptotic decider: G.M. Nielson, B. Hamann, "The asymptotic decider: resolving the ambiguity in marching
 * cubes", Proc. IEEE Visualization '91, pp. 83–91, 1991, DOI 10.1109/VISUAL.1991.175782.
 */

/**
 * How a saddle cell (two diagonally opposite solid corners) is resolved: 'decider' joins the solid corners when
 * the bilinear interpolant's saddle value is ≥ the level (Nielson & Hamann 1991); 'join' always (solid
 * 8-connected); 'split' never (solid 4-connected, as d3-contour).
 */
export type SaddleRule = 'decider' | 'join' | 'split';

export const SADDLE_RULES: readonly SaddleRule[] = ['decider', 'join', 'split'];

/**
 * True when the solid corners s1, s2 of a saddle cell are joined through it ('decider': a sign test
 * equivalent to "saddle value ≥ level", docs/notes/outline.md §3).
 */
export function joinsSolid(s1: number, s2: number, v1: number, v2: number, level: number, rule: SaddleRule): boolean {
  if (rule === 'join') return true;
  if (rule === 'split') return false;
  return (s1 - level) * (s2 - level) >= (v1 - level) * (v2 - level);
}

/**
 * Fraction of the way from a solid end (vs ≥ L) to a void end (vq < L) where the linear interpolant equals L,
 * in [0, 1). From the solid end, so that a void end at −∞ puts the crossing exactly on the solid end.
 */
export function crossing(vs: number, vq: number, level: number): number {
  return (level - vs) / (vq - vs);
}

/**
 * By case index (corner flags bottom-left | bottom-right << 1 | top-right << 2 | top-left << 3; 5 and 10 are
 * the saddles), the edge (0 bottom, 1 right, 2 top, 3 left) where the boundary segment leaves the solid and
 * the edge where it enters it, going counter-clockwise: solid on the left, outer rings counter-clockwise.
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

/** The cautions every report, the README and the docs carry (docs/cautions.md explains them). */
export const CAUTIONS: readonly string[] = [
  'This geometry is derived from a density field by thresholding, smoothing and simplification; it is not the analysed design. Re-analyse the final geometry (stiffness, strength, buckling, fatigue) before any use.',
  'Process limits used by the checks are generic defaults only; the limits of your fabricator, machine and material govern.',
  'A passing report does not make a part safe: defer to the applicable local codes and standards, the fabricator, and licensed engineering practice.',
];

/** Added to the cautions when the structural re-check ran (`--loads`, docs/structure.md). */
export const STRUCTURE_CAUTION =
  'The structural re-check (--loads) is a linear plane-stress analysis on the grid, not a certified analysis: it ignores contact, bolt bearing, buckling, fatigue and plasticity, and its stresses at clamped edges, sharp corners and point loads are singular. Re-analyse the final geometry with your own tools before use.';

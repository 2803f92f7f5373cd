/** The cautions every report, the README and the docs carry (docs/cautions.md explains them). */
export const CAUTIONS: readonly string[] = [
  'This geometry is derived from a density field by thresholding, smoothing and simplification; it is not the analysed design. Re-analyse the final geometry (stiffness, strength, buckling, fatigue) before any use.',
  'Process limits used by the checks are generic defaults only; the limits of your fabricator, machine and material govern.',
  'A passing report does not make a part safe: defer to the applicable local codes and standards, the fabricator, and licensed engineering practice.',
];

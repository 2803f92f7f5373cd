/**
 * Does a set of fixed dofs hold a plane body still? A plane body has three rigid-body modes: translation in x,
 * translation in y and rotation about the origin (node at (x, y) moves (−y, x)·θ). The supports hold it when
 * no combination of the three leaves every fixed dof at zero, i.e. when the matrix R (one row per fixed dof,
 * one column per mode, the mode's value at that dof) has rank 3. We test the eigenvalues of the 3×3 Gram
 * matrix RᵀR, with coordinates centred and scaled by the domain size so the test does not depend on units.
 *
 * This checks the grid domain as one body (every element has at least the minimum stiffness); a piece of the
 * part that only void holds to the supports is a separate question (it shows as a large displacement).
 */

export type RigidMode = 'x' | 'y' | 'rotation';

/**
 * The rigid-body modes the fixed dofs leave free, as the smallest set of plain descriptions:
 * [] when the body is held. `fixed[2n + c]` on nodes n = j·nx + i at (i·hx, j·hy).
 */
export function freeRigidModes(nx: number, ny: number, hx: number, hy: number, fixed: Uint8Array): RigidMode[] {
  const L = Math.max((nx - 1) * hx, (ny - 1) * hy, 1e-300);
  const xc = ((nx - 1) * hx) / 2;
  const yc = ((ny - 1) * hy) / 2;
  // Gram matrix of the modes over the fixed dofs: columns tx = (1, 0), ty = (0, 1), rot = (−ŷ, x̂)
  let gxx = 0;
  let gyy = 0;
  let gxr = 0;
  let gyr = 0;
  let grr = 0;
  for (let n = 0; n < nx * ny; n++) {
    const i = n % nx;
    const j = (n - i) / nx;
    const X = (i * hx - xc) / L;
    const Y = (j * hy - yc) / L;
    if (fixed[2 * n]) {
      gxx += 1;
      gxr += -Y;
      grr += Y * Y;
    }
    if (fixed[2 * n + 1]) {
      gyy += 1;
      gyr += X;
      grr += X * X;
    }
  }
  const free: RigidMode[] = [];
  if (gxx === 0) free.push('x');
  if (gyy === 0) free.push('y');
  // Schur complement of the rotation after the translations that are held
  let rr = grr;
  if (gxx > 0) rr -= (gxr * gxr) / gxx;
  if (gyy > 0) rr -= (gyr * gyr) / gyy;
  // a rotation is free when no fixed dof resists it beyond what the translations explain; the threshold is a
  // fraction of one node's lever arm on the grid (coordinates are in units of the domain size)
  const h = Math.min(hx, hy) / L;
  if (!(rr > 0.25 * h * h)) free.push('rotation');
  return free;
}

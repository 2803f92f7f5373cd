/** Whether fixed dofs hold a plane body still: rank 3 of the rigid-body modes over them (docs/notes/fe.md). */

export type RigidMode = 'x' | 'y' | 'rotation';

/** The free rigid-body modes; [] when held. `fixed[2n + c]` on nodes n = j·nx + i at (i·hx, j·hy). */
export function freeRigidModes(nx: number, ny: number, hx: number, hy: number, fixed: Uint8Array): RigidMode[] {
  const L = Math.max((nx - 1) * hx, (ny - 1) * hy, 1e-300);
  const xc = ((nx - 1) * hx) / 2;
  const yc = ((ny - 1) * hy) / 2;
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
  // Schur complement of the rotation after the held translations
  let rr = grr;
  if (gxx > 0) rr -= (gxr * gxr) / gxx;
  if (gyy > 0) rr -= (gyr * gyr) / gyy;
  // threshold: a fraction of one node's lever arm (coordinates in domain units)
  const h = Math.min(hx, hy) / L;
  if (!(rr > 0.25 * h * h)) free.push('rotation');
  return free;
}

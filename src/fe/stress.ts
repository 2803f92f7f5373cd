/**
 * Von Mises at the element centre in the solid material (the "microscopic" stress of Duysinx & Bendsøe,
 * "Topology optimization of continuum structures with local stress constraints", IJNME 43:1453–1478, 1998).
 */
import { planeStressD, strainMatrix } from './element.js';

/** MPa per element, index ej·ex + ei; `u` in mm, E in MPa. */
export function vonMises(ex: number, ey: number, hx: number, hy: number, E: number, nu: number, u: Float64Array): Float64Array {
  const B = strainMatrix(hx, hy, 0, 0);
  const D = planeStressD(nu);
  const out = new Float64Array(ex * ey);
  const nx = ex + 1;
  const ue = new Float64Array(8);
  for (let j = 0; j < ey; j++) {
    for (let i = 0; i < ex; i++) {
      const n0 = j * nx + i;
      const nodes0 = n0;
      const nodes1 = n0 + 1;
      const nodes2 = n0 + nx + 1;
      const nodes3 = n0 + nx;
      ue[0] = u[2 * nodes0];
      ue[1] = u[2 * nodes0 + 1];
      ue[2] = u[2 * nodes1];
      ue[3] = u[2 * nodes1 + 1];
      ue[4] = u[2 * nodes2];
      ue[5] = u[2 * nodes2 + 1];
      ue[6] = u[2 * nodes3];
      ue[7] = u[2 * nodes3 + 1];
      let exx = 0;
      let eyy = 0;
      let gxy = 0;
      for (let k = 0; k < 8; k++) {
        exx += B[k] * ue[k];
        eyy += B[8 + k] * ue[k];
        gxy += B[16 + k] * ue[k];
      }
      const sx = E * (D[0] * exx + D[1] * eyy);
      const sy = E * (D[3] * exx + D[4] * eyy);
      const txy = E * D[8] * gxy;
      out[j * ex + i] = Math.sqrt(Math.max(0, sx * sx - sx * sy + sy * sy + 3 * txy * txy));
    }
  }
  return out;
}

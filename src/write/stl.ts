/**
 * Binary STL of a triangle mesh (mm): an 80-byte header, the triangle count (uint32 little-endian), then per
 * triangle its unit normal and three vertices as float32 little-endian and a uint16 attribute of 0 — 50 bytes
 * each. Format as defined by 3D Systems, "StereoLithography Interface Specification" (1988) and as every
 * slicer reads it (from memory); the facet normal follows the right-hand rule of the vertex order, pointing
 * out of the solid. STL has no unit: the coordinates are millimetres, as slicers assume.
 */
import type { Mesh } from '../geom/extrude.js';
import { hypot } from '../geom/portable-math.js';

/** The 80 header bytes: ASCII text that does not start with "solid" (which would suggest an ASCII STL). */
const HEADER = 'rhoform binary STL, units mm, part extruded along z';

export function writeStl(mesh: Mesh): Uint8Array {
  const { vertices: v, triangles: t } = mesh;
  const count = t.length / 3;
  const bytes = new Uint8Array(84 + 50 * count);
  for (let i = 0; i < HEADER.length; i++) bytes[i] = HEADER.charCodeAt(i);
  const view = new DataView(bytes.buffer);
  view.setUint32(80, count, true);
  let o = 84;
  for (let f = 0; f < count; f++) {
    const a = 3 * t[3 * f], b = 3 * t[3 * f + 1], c = 3 * t[3 * f + 2];
    const ux = v[b] - v[a], uy = v[b + 1] - v[a + 1], uz = v[b + 2] - v[a + 2];
    const wx = v[c] - v[a], wy = v[c + 1] - v[a + 1], wz = v[c + 2] - v[a + 2];
    let nx = uy * wz - uz * wy, ny = uz * wx - ux * wz, nz = ux * wy - uy * wx;
    const len = hypot(nx, ny, nz);
    if (len > 0) {
      nx /= len;
      ny /= len;
      nz /= len;
    }
    view.setFloat32(o, nx, true);
    view.setFloat32(o + 4, ny, true);
    view.setFloat32(o + 8, nz, true);
    o += 12;
    for (const k of [a, b, c]) {
      view.setFloat32(o, v[k], true);
      view.setFloat32(o + 4, v[k + 1], true);
      view.setFloat32(o + 8, v[k + 2], true);
      o += 12;
    }
    view.setUint16(o, 0, true);
    o += 2;
  }
  return bytes;
}

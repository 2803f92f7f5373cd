/** A minimal NPY 1.0 writer for benchmark grids (little-endian float64 or float32, C order). Not part of the library. */

function npy(descr: string, data: Uint8Array, rows: number, cols: number): Uint8Array {
  let header = `{'descr': '${descr}', 'fortran_order': False, 'shape': (${rows}, ${cols}), }`;
  const total = 10 + header.length + 1;
  header += ' '.repeat((64 - (total % 64)) % 64) + '\n';
  const out = new Uint8Array(10 + header.length + data.byteLength);
  out.set([0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59, 1, 0], 0);
  out[8] = header.length & 0xff;
  out[9] = header.length >> 8;
  for (let k = 0; k < header.length; k++) out[10 + k] = header.charCodeAt(k);
  out.set(data, 10 + header.length);
  return out;
}

export function npyFloat64(values: Float64Array, rows: number, cols: number): Uint8Array {
  return npy('<f8', new Uint8Array(values.buffer, values.byteOffset, values.byteLength), rows, cols);
}

export function npyFloat32(values: Float64Array, rows: number, cols: number): Uint8Array {
  const f = Float32Array.from(values);
  return npy('<f4', new Uint8Array(f.buffer), rows, cols);
}

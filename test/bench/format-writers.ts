/**
 * Minimal writers of the benchmark field in each input format (not part of the library): MAT level 5 (one double
 * matrix, plain or zlib-compressed), legacy VTK BINARY (big-endian) and ASCII, VTI (appended raw, base64, zlib
 * blocks), and PNG through fast-png's encoder. `values` are in grid order (row j = 0 at the bottom).
 */
import { deflateSync } from 'node:zlib';
import { encode } from 'fast-png';

/** Rows top first, as MATLAB, numpy and images show them. */
function topFirst(values: Float64Array, rows: number, cols: number): Float64Array {
  const out = new Float64Array(values.length);
  for (let r = 0; r < rows; r++) out.set(values.subarray((rows - 1 - r) * cols, (rows - r) * cols), r * cols);
  return out;
}

export function matDouble(values: Float64Array, rows: number, cols: number, compress: boolean): Uint8Array {
  const top = topFirst(values, rows, cols);
  const data = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) data[c * rows + r] = top[r * cols + c];
  const body = new Uint8Array(8 + 16 + 16 + 8 + 8 + data.byteLength);
  const v = new DataView(body.buffer);
  v.setUint32(0, 14, true); v.setUint32(4, body.length - 8, true);
  v.setUint32(8, 6, true); v.setUint32(12, 8, true); v.setUint32(16, 6, true);
  v.setUint32(24, 5, true); v.setUint32(28, 8, true); v.setInt32(32, rows, true); v.setInt32(36, cols, true);
  v.setUint32(40, (1 << 16) | 1, true); body[44] = 0x78; // name "x", small element
  v.setUint32(48, 9, true); v.setUint32(52, data.byteLength, true);
  body.set(new Uint8Array(data.buffer), 56);
  const header = new Uint8Array(128).fill(0x20);
  header.set(new TextEncoder().encode('MATLAB 5.0 MAT-file, benchmark'), 0);
  header.fill(0, 116, 124);
  header[124] = 0; header[125] = 1; header[126] = 0x49; header[127] = 0x4d;
  if (!compress) return concat(header, body);
  const z = deflateSync(body);
  const tag = new Uint8Array(8);
  new DataView(tag.buffer).setUint32(0, 15, true);
  new DataView(tag.buffer).setUint32(4, z.length, true);
  return concat(header, tag, z);
}

function concat(...parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((a, p) => a + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}

export function vtkLegacy(values: Float64Array, rows: number, cols: number, binary: boolean): Uint8Array {
  const head = new TextEncoder().encode(`# vtk DataFile Version 3.0\nbench\n${binary ? 'BINARY' : 'ASCII'}\nDATASET STRUCTURED_POINTS\nDIMENSIONS ${cols + 1} ${rows + 1} 1\nORIGIN 0 0 0\nSPACING 1 1 1\nCELL_DATA ${rows * cols}\nSCALARS rho double 1\nLOOKUP_TABLE default\n`);
  if (!binary) {
    const lines: string[] = [];
    for (let k = 0; k < values.length; k += 9) lines.push(Array.from(values.subarray(k, k + 9), (x) => String(x)).join(' '));
    return concat(head, new TextEncoder().encode(lines.join('\n') + '\n'));
  }
  const data = new Uint8Array(values.byteLength);
  const v = new DataView(data.buffer);
  for (let k = 0; k < values.length; k++) v.setFloat64(8 * k, values[k], false);
  return concat(head, data, new Uint8Array([0x0a]));
}

export type VtiMode = 'appended-raw' | 'base64' | 'base64-zlib' | 'appended-raw-zlib';

export function vti(values: Float64Array, rows: number, cols: number, mode: VtiMode): Uint8Array {
  const raw = new Uint8Array(values.buffer, values.byteOffset, values.byteLength);
  const zlib = mode.endsWith('zlib');
  let payload: Uint8Array;
  let headerBytes = new Uint8Array(0);
  if (zlib) {
    const bs = 32768;
    const blocks: Uint8Array[] = [];
    for (let o = 0; o < raw.length; o += bs) blocks.push(deflateSync(raw.subarray(o, o + bs)));
    const last = raw.length % bs;
    const h = new Uint32Array([blocks.length, bs, last, ...blocks.map((b) => b.length)]);
    headerBytes = new Uint8Array(h.buffer);
    payload = concat(...blocks);
  } else {
    headerBytes = new Uint8Array(new Uint32Array([raw.length]).buffer);
    payload = raw;
  }
  const attrs = `type="ImageData" version="1.0" byte_order="LittleEndian" header_type="UInt32"${zlib ? ' compressor="vtkZLibDataCompressor"' : ''}`;
  const open = `<?xml version="1.0"?>\n<VTKFile ${attrs}>\n<ImageData WholeExtent="0 ${cols} 0 ${rows} 0 0" Origin="0 0 0" Spacing="1 1 1">\n<Piece Extent="0 ${cols} 0 ${rows} 0 0">\n<CellData Scalars="rho">\n`;
  const close = '</CellData>\n</Piece>\n</ImageData>\n';
  const enc = new TextEncoder();
  if (mode.startsWith('appended')) {
    return concat(
      enc.encode(`${open}<DataArray type="Float64" Name="rho" format="appended" offset="0"/>\n${close}<AppendedData encoding="raw">\n_`),
      headerBytes,
      payload,
      enc.encode('\n</AppendedData>\n</VTKFile>\n'),
    );
  }
  const text = zlib ? Buffer.from(headerBytes).toString('base64') + Buffer.from(payload).toString('base64') : Buffer.from(concat(headerBytes, payload)).toString('base64');
  return enc.encode(`${open}<DataArray type="Float64" Name="rho" format="binary">\n${text}\n</DataArray>\n${close}</VTKFile>\n`);
}

/** A grey PNG of the field, dark = solid (density 1 → 0), at 8 or 16 bits. */
export function pngGrey(values: Float64Array, rows: number, cols: number, depth: 8 | 16): Uint8Array {
  const top = topFirst(values, rows, cols);
  const max = depth === 8 ? 255 : 65535;
  const data = depth === 8 ? new Uint8Array(rows * cols) : new Uint16Array(rows * cols);
  for (let k = 0; k < data.length; k++) data[k] = Math.round((1 - Math.min(1, Math.max(0, top[k]))) * max);
  return encode({ width: cols, height: rows, data, depth, channels: 1 });
}

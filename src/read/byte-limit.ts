/**
 * How many bytes a grid file may hold for a given `maxCells`, decided from its first bytes before the whole
 * file is read (so a huge file is refused before it is in memory).
 *
 * - NPY (the magic \x93NUMPY, or a .npy name): the header end (from the declared header length, NEP 1) plus
 *   8 bytes per sample (the widest dtype the reader takes, f8/i8/u8) for `maxCells` samples, plus
 *   NPY_TRAILING_BYTES of anything written after the array (the reader warns about those).
 * - Anything else (delimited text, and formats read later from these bytes): TEXT_BYTES_PER_CELL per sample
 *   plus TEXT_SLACK_BYTES for headers and comments. numpy.savetxt's default '%.18e' writes 24–25 characters a
 *   value, so a long-form line x, y, value takes about 78 bytes; 128 leaves room for spaces and quotes.
 */
/** Bytes allowed per sample of a text grid (see above). */
export const TEXT_BYTES_PER_CELL = 128;
/** Bytes of header lines, comments and blank lines allowed on top. */
export const TEXT_SLACK_BYTES = 1 << 20;
/** Bytes allowed after the data of an NPY file. */
export const NPY_TRAILING_BYTES = 1 << 16;

const MAGIC = [0x93, 0x4e, 0x55, 0x4d, 0x50, 0x59];

/** The largest file (bytes) that can hold at most `maxCells` samples, judged from its first bytes `head`. */
export function maxGridBytes(head: Uint8Array, name: string, maxCells: number): number {
  const npy = (head.length >= 6 && MAGIC.every((b, k) => head[k] === b)) || /\.npy$/i.test(name);
  if (!npy) return maxCells * TEXT_BYTES_PER_CELL + TEXT_SLACK_BYTES;
  let headerEnd = 10;
  if (head.length >= 12) {
    const dv = new DataView(head.buffer, head.byteOffset, head.byteLength);
    headerEnd = head[6] === 1 ? 10 + dv.getUint16(8, true) : 12 + dv.getUint32(8, true);
  }
  return headerEnd + maxCells * 8 + NPY_TRAILING_BYTES;
}

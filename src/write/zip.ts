/**
 * A minimal ZIP writer: stored (uncompressed) entries, as the 3MF package needs. Layout per PKWARE's
 * APPNOTE.TXT (.ZIP File Format Specification, version 6.3.x): for each entry a local file header
 * (signature 0x04034b50) and its data, then one central directory header per entry (0x02014b50) and the end
 * of central directory record (0x06054b50); all integers little-endian; method 0 (stored); CRC-32 of the data
 * (polynomial 0xEDB88320, reflected, initial and final XOR 0xFFFFFFFF — APPNOTE §4.4.7). Every entry carries
 * the same fixed date (1980-01-01 00:00, the format's earliest), so the same content gives the same bytes.
 * Names are ASCII; no ZIP64, so the whole package stays below 4 GiB (checked).
 */
import { RhoformError } from '../errors.js';
import { crc32 } from './crc32.js';

/** DOS date of 1980-01-01 (year − 1980 = 0, month 1, day 1) and time 00:00:00. */
const DOS_DATE = (0 << 9) | (1 << 5) | 1;
const DOS_TIME = 0;

export interface ZipEntry {
  readonly name: string;
  readonly data: Uint8Array;
}

/** The entries as one stored ZIP archive, in the given order. */
export function zipStored(entries: readonly ZipEntry[]): Uint8Array {
  const names = entries.map((e) => {
    if (!/^[\x20-\x7e]+$/.test(e.name)) throw new RhoformError('E_INTERNAL', `expected an ASCII zip entry name, found ${JSON.stringify(e.name)}`);
    return Uint8Array.from(e.name, (ch) => ch.charCodeAt(0));
  });
  let size = 22;
  entries.forEach((e, i) => (size += 30 + names[i].length + e.data.length + 46 + names[i].length));
  if (size > 0xffffffff) throw new RhoformError('E_INTERNAL', `expected a 3MF package below 4 GiB, found ${size} bytes`);
  const out = new Uint8Array(size);
  const view = new DataView(out.buffer);
  let o = 0;
  const offsets: number[] = [];
  const crcs = entries.map((e) => crc32(e.data));
  const header = (sig: number, central: boolean, i: number): void => {
    const e = entries[i];
    view.setUint32(o, sig, true);
    o += 4;
    if (central) {
      view.setUint16(o, 20, true); // version made by: 2.0, MS-DOS attributes
      o += 2;
    }
    view.setUint16(o, 20, true); // version needed to extract: 2.0
    view.setUint16(o + 2, 0, true); // flags
    view.setUint16(o + 4, 0, true); // method: stored
    view.setUint16(o + 6, DOS_TIME, true);
    view.setUint16(o + 8, DOS_DATE, true);
    view.setUint32(o + 10, crcs[i], true);
    view.setUint32(o + 14, e.data.length, true); // compressed size
    view.setUint32(o + 18, e.data.length, true); // uncompressed size
    view.setUint16(o + 22, names[i].length, true);
    view.setUint16(o + 24, 0, true); // extra field length
    o += 26;
    if (central) {
      view.setUint16(o, 0, true); // comment length
      view.setUint16(o + 2, 0, true); // disk number start
      view.setUint16(o + 4, 0, true); // internal attributes
      view.setUint32(o + 6, 0, true); // external attributes
      view.setUint32(o + 10, offsets[i], true); // offset of the local header
      o += 14;
    }
    out.set(names[i], o);
    o += names[i].length;
  };
  entries.forEach((e, i) => {
    offsets.push(o);
    header(0x04034b50, false, i);
    out.set(e.data, o);
    o += e.data.length;
  });
  const cdStart = o;
  entries.forEach((_, i) => header(0x02014b50, true, i));
  const cdSize = o - cdStart;
  view.setUint32(o, 0x06054b50, true);
  view.setUint16(o + 4, 0, true); // this disk
  view.setUint16(o + 6, 0, true); // disk with the central directory
  view.setUint16(o + 8, entries.length, true);
  view.setUint16(o + 10, entries.length, true);
  view.setUint32(o + 12, cdSize, true);
  view.setUint32(o + 16, cdStart, true);
  view.setUint16(o + 20, 0, true); // comment length
  return out;
}

/**
 * The floor of `npm run bench` (issue 15): a fresh Node process that reads an NPY file and touches every value
 * once (sums them), and nothing else. A build cannot be faster than this; the bench reports each build as a
 * multiple of it. Usage: node dist/test/bench/floor.js <file.npy>
 */
import { readFileSync } from 'node:fs';

const bytes = readFileSync(process.argv[2]);
const headerLen = bytes[6] === 1 ? bytes[8] | (bytes[9] << 8) : bytes.readUInt32LE(8);
const dataOffset = (bytes[6] === 1 ? 10 : 12) + headerLen;
const header = bytes.subarray(0, dataOffset).toString('latin1');
const f4 = header.includes("'<f4'");
const n = (bytes.length - dataOffset) / (f4 ? 4 : 8);
const abs = bytes.byteOffset + dataOffset;
const size = f4 ? 4 : 8;
const data = abs % size === 0 ? bytes : Buffer.from(bytes); // an aligned copy only if the header is odd-sized
const view = f4 ? new Float32Array(data.buffer, data.byteOffset + dataOffset, n) : new Float64Array(data.buffer, data.byteOffset + dataOffset, n);
let sum = 0;
for (let k = 0; k < n; k++) sum += view[k];
console.log(sum);

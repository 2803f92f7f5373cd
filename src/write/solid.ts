/**
 * The solid outputs (`--formats stl,3mf`, DESIGN §14): the part extruded by `--thickness` (src/geom/extrude.ts)
 * as binary STL (src/write/stl.ts) or a 3MF package (src/write/threemf.ts). mm.
 */
import { UsageError } from '../errors.js';
import { extrude, type SolidInput } from '../geom/extrude.js';
import { writeStl } from './stl.js';
import { write3mf } from './threemf.js';

/** The file bytes of one solid format. Throws UsageError naming `--thickness` when it is missing. */
export function writeSolid(format: 'stl' | '3mf', input: Omit<SolidInput, 'thickness'> & { thickness: number | null }): Uint8Array {
  if (input.thickness === null) throw new UsageError(`--formats ${format}: expected --thickness <mm> (the extrusion), found none`);
  const mesh = extrude({ ...input, thickness: input.thickness });
  return format === 'stl' ? writeStl(mesh) : write3mf(mesh);
}

/** The bundled demo (`rhoform demo`): its grid and the settings it is built with. */
import { REPAIR_IDS, type Settings } from '../src/settings.js';

/**
 * A grid of our own scenario and the settings it is meant to be built with — 2 mm cells, and the bracket is
 * waterjet-cut from 8 mm aluminium sheet (fixtures/grids/demo-bracket.md), so the checks use that process's
 * generic limits; its bolt holes and motor pad are passive regions of its own file; and it is repaired, so the
 * report shows the findings before repair next to the repaired result; and it is re-analysed under its service
 * load case (fixtures/loads/demo-bracket.loads.json), so the report says what the post-processing cost in
 * stiffness.
 */
export const DEMO = {
  file: 'fixtures/grids/demo-bracket.npy',
  settings: {
    cellSize: [2, 2],
    process: 'waterjet-cut',
    thickness: 8,
    passive: 'fixtures/passive/demo-bracket.passive.json',
    repair: [...REPAIR_IDS],
    loads: 'fixtures/loads/demo-bracket.loads.json',
  } as Partial<Settings>,
};

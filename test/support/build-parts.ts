/** Imported for its effect: loads every part a `build` may need (repairs, the structural re-check, solid writers). */
import { prepareBuild } from '../../src/pipeline.js';

await prepareBuild({ passive: 'any', mirror: [], repair: ['thicken'], loads: 'any', formats: ['stl'] });

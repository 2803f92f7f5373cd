export { analyse, coarseningFactor, FE_MAX_ELEMENTS, type FeAnalysis, type FeDesign, type FeGridSpec, type FeOptions, type FeWorkspace, type Located } from './analyse.js';
export { coverage, type CoverageGrid } from './coverage.js';
export { elementStiffness, planeStressD, strainMatrix } from './element.js';
export { freeRigidModes, type RigidMode } from './rigid.js';
export { solveElastic, type ElasticProblem, type ElasticSolution, type SolveOptions } from './solve.js';
export type { SolverStats, CgOptions } from './cg.js';
export { vonMises } from './stress.js';
export { coarsenCells, nodalToCells } from './resample.js';

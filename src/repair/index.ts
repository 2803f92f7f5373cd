/** The repair engine (`--repair[=list]`, docs/repair.md): public entry points. */
export { runRepairs, MAX_ROUNDS } from './run.js';
export { REPAIR_CHECKS, type RepairAction, type RepairInput, type RepairLimits } from './types.js';

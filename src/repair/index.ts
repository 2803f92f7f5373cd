export { runRepairs, MAX_ROUNDS } from './run.js';
export { REPAIR_CHECKS, type RepairAction, type RepairInput, type RepairLimits } from './types.js';

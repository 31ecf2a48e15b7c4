// Public entry of the Fluxfolio solver: specs, tasks, eigensolvers, lattice and errors (no React, no Next.js).
// Import from '@/lib/physics' unless a module needs a private piece.
export * from './errors';
export type * from './types';
export { parseTaskSpec, taskSpecSchema, type TaskSpec, type TaskSpecInput } from './schemas';
export { runTask, TASK_NAMES, type TaskName, type TaskResult, type RunTaskContext } from './run-task';
export { runSpectrum, type SpectrumResult, type SpectrumStates } from './tasks/spectrum';
export { lowestEigenpairs, degenerateGroups, fixPhases } from './eigen';
export { prepareProblem, type PreparedProblem, type ProblemSpec } from './problem';
export { buildLattice, siteXY, snapTube, plaquetteCentre } from './lattice';
export { buildHamiltonian, isRealFlux, cutFlux } from './hamiltonian';
export { compileWell, type Well } from './wells';
export { compilePotential } from './potential';
export { checkBudget, currentBudget, estimateMemoryBytes } from './limits';
export { canonicalJson, resultHash } from './canonical';
export { SOLVER_REVISION, SOLVER_VERSION } from './version';

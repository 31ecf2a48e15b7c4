// Solver version, owned by the solver itself: the release of the numerical core plus its revision. Results and input
// hashes record it; bump SOLVER_REVISION whenever numbers the solver produces may change. (The git commit is the caller's.)

/** Revision of the numerical core; part of SOLVER_VERSION. */
export const SOLVER_REVISION = 'solver.1';

/** "0.1.0+solver.1": input hashes depend on this exact string, so it changes only with the numbers. */
export const SOLVER_VERSION = `0.1.0+${SOLVER_REVISION}`;

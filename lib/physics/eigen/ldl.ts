// Sparse LDL^T (real symmetric) and LDL^H (complex Hermitian) factorisation of A - sigma I, and block solves.
// One entry point for the three phases: symbolic analysis, numeric factorisation, triangular solves (ldl-*.ts).
export { analyzeLdl, matchesPattern } from './ldl-symbolic';
export { factorLdl } from './ldl-numeric';
export { solveLdl } from './ldl-solve';
export { LdlPivotError, SINGULAR_PIVOT, type LdlAnalyzeOptions, type LdlFactor, type LdlFactorOptions, type LdlSymbolic } from './ldl-types';

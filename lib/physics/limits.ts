// Budgets that keep one request from exhausting the machine: unknowns, memory and work (unknowns x configurations).
// Every refusal is a LimitError whose message says what to change.
import { LimitError } from './errors';

/** Default cap on unknowns (override with env FLUXFOLIO_MAX_UNKNOWNS). */
export const DEFAULT_MAX_UNKNOWNS = 250_000;
/** Default cap on unknowns x configurations for sweeps and scans (override with env FLUXFOLIO_MAX_WORK). */
export const DEFAULT_MAX_WORK = 400_000_000;
/** Default memory cap of one eigen-solve in MiB (override with env FLUXFOLIO_MAX_MEMORY_MB). */
export const DEFAULT_MAX_MEMORY_MB = 2048;
/** The lattice box may hold at most this many times the unknown cap (the box is mostly wall for thin wells). */
const BOX_FACTOR = 64;

function envInt(name: string, fallback: number): number {
  const raw = typeof process !== 'undefined' ? process.env[name] : undefined;
  const value = raw === undefined || raw === '' ? NaN : Number(raw);
  return Number.isFinite(value) && value > 0 ? Math.floor(value) : fallback;
}

export interface Budget {
  maxUnknowns: number;
  maxWork: number;
  maxMemoryBytes: number;
}

/** The budget in force (read from the environment on every call, so tests and workers can change it). */
export function currentBudget(): Budget {
  return {
    maxUnknowns: envInt('FLUXFOLIO_MAX_UNKNOWNS', DEFAULT_MAX_UNKNOWNS),
    maxWork: envInt('FLUXFOLIO_MAX_WORK', DEFAULT_MAX_WORK),
    maxMemoryBytes: envInt('FLUXFOLIO_MAX_MEMORY_MB', DEFAULT_MAX_MEMORY_MB) * 1024 * 1024,
  };
}

const fmt = (v: number) => Math.round(v).toLocaleString('en-US');

/** Rounds up to two significant digits (for suggested grid spacings). */
function roundUp2(v: number): number {
  const p = 10 ** (Math.floor(Math.log10(v)) - 1);
  return Math.ceil(v / p - 1e-9) * p;
}

/** Formats a spacing without float noise (0.0036, not 0.0036000000000000003). */
function fmtH(v: number): string {
  return String(Number(v.toPrecision(2)));
}

/**
 * Rough memory need in bytes of one eigen-solve: matrix (5 entries a row) plus the LOBPCG blocks.
 * @param unknowns - lattice unknowns n
 * @param levels - wanted eigenpairs k
 * @param complex - complex Hermitian problem (doubles the vector storage)
 */
export function estimateMemoryBytes(unknowns: number, levels: number, complex: boolean): number {
  const m = levels + Math.max(2, Math.ceil(0.25 * levels));
  const matrix = unknowns * 5 * (4 + 8 * (complex ? 2 : 1)) + 4 * (unknowns + 1);
  const blocks = unknowns * (3 * m * 4 + 3 * m) * 8 * (complex ? 2 : 1);
  return matrix + blocks;
}

export interface BudgetRequest {
  /** Unknowns of the lattice (sites strictly inside). */
  unknowns: number;
  /** Grid spacing, to suggest a coarser one. */
  h: number;
  /** Number of configurations (sweep steps, scan positions); default 1. */
  configurations?: number;
  /** Box sites (nx * ny), checked before the well is rasterised (unknowns may then be an estimate). */
  boxSites?: number;
  /** Levels wanted per solve, for the memory estimate (checked when given). */
  levels?: number;
  /** Complex Hermitian problem (doubles vector memory). */
  complex?: boolean;
}

/**
 * Throws LimitError when a request exceeds the budget.
 * @example
 * checkBudget({ unknowns: 3_140_000, h: 0.001 });
 * // LimitError: grid h = 0.001 gives about 3,140,000 unknowns; the limit is 250,000: use h >= 0.0036 or a smaller well
 */
export function checkBudget(request: BudgetRequest): void {
  const budget = currentBudget();
  const { h } = request;
  if (request.boxSites !== undefined && request.boxSites > BOX_FACTOR * budget.maxUnknowns) {
    const suggest = roundUp2(h * Math.sqrt(request.boxSites / (BOX_FACTOR * budget.maxUnknowns)));
    throw new LimitError(
      `grid h = ${h} needs a box of about ${fmt(request.boxSites)} sites; the limit is ${fmt(BOX_FACTOR * budget.maxUnknowns)}: use h >= ${fmtH(suggest)} or a smaller well`,
    );
  }
  if (request.unknowns > budget.maxUnknowns) {
    const suggest = roundUp2(h * Math.sqrt(request.unknowns / budget.maxUnknowns));
    throw new LimitError(
      `grid h = ${h} gives about ${fmt(request.unknowns)} unknowns; the limit is ${fmt(budget.maxUnknowns)}: use h >= ${fmtH(suggest)} or a smaller well`,
    );
  }
  if (request.levels !== undefined) {
    const bytes = estimateMemoryBytes(request.unknowns, request.levels, request.complex ?? true);
    if (bytes > budget.maxMemoryBytes) {
      const mb = (v: number) => fmt(v / (1024 * 1024));
      throw new LimitError(
        `${request.levels} levels on ${fmt(request.unknowns)} unknowns need about ${mb(bytes)} MiB; the limit is ${mb(budget.maxMemoryBytes)} MiB: ask for fewer levels or use a larger h`,
      );
    }
  }
  const configurations = request.configurations ?? 1;
  const work = request.unknowns * configurations;
  if (work > budget.maxWork) {
    const maxConfigs = Math.max(1, Math.floor(budget.maxWork / request.unknowns));
    const suggest = roundUp2(h * Math.sqrt(work / budget.maxWork));
    throw new LimitError(
      `${fmt(configurations)} configurations of ${fmt(request.unknowns)} unknowns is about ${fmt(work)} unknown-solves; ` +
        `the limit is ${fmt(budget.maxWork)}: use at most ${fmt(maxConfigs)} configurations, or h >= ${fmtH(suggest)}`,
    );
  }
}

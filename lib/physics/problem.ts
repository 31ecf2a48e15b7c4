// prepareProblem: from a validated base spec to the well, lattice, snapped tubes and a Hamiltonian builder in one call.
// Tasks use it so that they all rasterise, snap and check budgets the same way.
import { buildHamiltonian } from './hamiltonian';
import { buildLattice, snapTube } from './lattice';
import { checkBudget } from './limits';
import { compilePotential } from './potential';
import type { GridSpec, TubeSpec, WellSpec } from './schemas/common';
import type { CsrMatrix, Lattice, SnappedTube, Vec2 } from './types';
import { compileWell, type Well } from './wells';
import { SpecError } from './errors';

/** The fields of a base problem that prepareProblem reads (a validated spec of any task will do). */
export interface ProblemSpec {
  well: WellSpec;
  grid: GridSpec;
  tubes?: TubeSpec[];
  potential?: string;
}

export interface PrepareOptions {
  /** Extra boxes the lattice must cover (e.g. where a moving tube goes). */
  cover?: { min: Vec2; max: Vec2 }[];
  /** Reads mask images by key. */
  resolveFile?: (key: string) => Uint8Array;
  /** Tubes appended after the spec's fixed tubes (snapped the same way). */
  extraTubes?: { at: Vec2; alpha: number }[];
  /** Number of configurations the task will solve (for the work budget). Default 1. */
  configurations?: number;
}

export interface PreparedProblem {
  well: Well;
  lattice: Lattice;
  /** The spec's tubes (then extraTubes), snapped to plaquette centres. */
  tubes: SnappedTube[];
  /** The Hamiltonian with `tubes`, or with `tubesOverride` when given. */
  matrix(tubesOverride?: SnappedTube[]): CsrMatrix;
}

/** Samples per axis of the quick area estimate made before rasterising. */
const AREA_SAMPLES = 200;

/** Unknowns expected at spacing h, from the fraction of a coarse sample grid of the bounding box inside the well. */
function estimateUnknowns(well: Well, h: number): number {
  const [x0, y0] = well.bbox.min;
  const [x1, y1] = well.bbox.max;
  let inside = 0;
  for (let j = 0; j < AREA_SAMPLES; j++) {
    const y = y0 + ((j + 0.5) / AREA_SAMPLES) * (y1 - y0);
    for (let i = 0; i < AREA_SAMPLES; i++) if (well.contains(x0 + ((i + 0.5) / AREA_SAMPLES) * (x1 - x0), y)) inside++;
  }
  return ((inside / (AREA_SAMPLES * AREA_SAMPLES)) * (x1 - x0) * (y1 - y0)) / (h * h);
}

/**
 * Compiles the well and potential, builds the lattice, snaps the tubes and checks the budget.
 *
 * @param spec - a validated base problem (well, grid, tubes, potential)
 * @param options - cover boxes, resolveFile for masks, extra tubes, configuration count
 * @throws SpecError (bad mask, polygon, potential, no unknowns) or LimitError (budget)
 * @example
 * const { lattice, matrix } = prepareProblem({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.05 }, tubes: [] });
 * lowestEigenpairs(matrix(), 4);
 */
export function prepareProblem(spec: ProblemSpec, options: PrepareOptions = {}): PreparedProblem {
  const well = compileWell(spec.well, { resolveFile: options.resolveFile });
  const h = spec.grid.h;
  const offset: Vec2 = spec.grid.offset ? [spec.grid.offset[0], spec.grid.offset[1]] : [0, 0];
  // Box size before rasterising, so that a huge request fails fast.
  let [x0, y0] = well.bbox.min;
  let [x1, y1] = well.bbox.max;
  for (const box of options.cover ?? []) {
    x0 = Math.min(x0, box.min[0]);
    y0 = Math.min(y0, box.min[1]);
    x1 = Math.max(x1, box.max[0]);
    y1 = Math.max(y1, box.max[1]);
  }
  const boxSites = ((x1 - x0) / h + 3) * ((y1 - y0) / h + 3);
  checkBudget({ unknowns: estimateUnknowns(well, h), h, boxSites });
  const potential = spec.potential ? compilePotential(spec.potential) : undefined;
  const lattice = buildLattice({ well, h, offset, cover: options.cover, potential });
  checkBudget({ unknowns: lattice.n, h, configurations: options.configurations ?? 1 });
  if (lattice.n === 0) {
    throw new SpecError(`the well holds no grid site at h = ${h}: use a smaller h or a larger well`, 'grid.h');
  }
  const tubes = [...(spec.tubes ?? []), ...(options.extraTubes ?? [])].map((t) => snapTube(lattice, t.at, t.alpha));
  return {
    well,
    lattice,
    tubes,
    matrix: (tubesOverride) => buildHamiltonian(lattice, tubesOverride ?? tubes),
  };
}

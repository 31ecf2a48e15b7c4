// Spec of the 'spectrum' task: the lowest levels (and optionally the states) of one configuration.
// Extends the base problem (well, grid, tubes, potential, tol).
import { z } from 'zod';
import { baseProblemSchema } from './common';

/** Number of levels a task may ask for. */
export const levelsSchema = z
  .number({ error: 'levels must be a whole number' })
  .int('levels must be a whole number')
  .min(1, 'levels must be at least 1')
  .max(64, 'levels must be at most 64');

export const spectrumSpecSchema = baseProblemSchema.extend({
  task: z.literal('spectrum'),
  levels: levelsSchema.default(6),
  /** Also return the states (density, phase, real and imaginary parts) on the grid. */
  states: z.boolean().optional(),
});
export type SpectrumSpec = z.infer<typeof spectrumSpecSchema>;

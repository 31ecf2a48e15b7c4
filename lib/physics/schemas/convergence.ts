// Spec of the 'convergence' task: a spectrum on grids h, h/2, h/4 with observed order and Richardson extrapolation.
// `of` is a spectrum spec without its `task` field.
import { z } from 'zod';
import { spectrumSpecSchema } from './spectrum';

export const convergenceSpecSchema = z.strictObject({
  task: z.literal('convergence'),
  of: spectrumSpecSchema.omit({ task: true, states: true }),
  refinements: z.union([z.literal(2), z.literal(3)], { error: 'refinements must be 2 or 3' }).default(3),
  /** Theoretical convergence order used for extrapolation (1 for staircase walls); observed order is shown beside it. */
  order: z.number().positive('order must be positive').max(4, 'order must be at most 4').optional(),
});
export type ConvergenceSpec = z.infer<typeof convergenceSpecSchema>;

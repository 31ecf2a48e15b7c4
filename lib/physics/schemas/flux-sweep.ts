// Spec of the 'flux-sweep' task: levels versus the flux of one tube (spectral flow), tracked through crossings.
// Extends the base problem; `sweep.tube` indexes the `tubes` array (its own alpha is replaced by the swept values).
import { z } from 'zod';
import { alphaSchema, baseProblemSchema } from './common';
import { levelsSchema } from './spectrum';

export const fluxSweepSpecSchema = baseProblemSchema
  .extend({
    task: z.literal('flux-sweep'),
    sweep: z.strictObject({
      tube: z.number().int('sweep.tube must be a whole number').min(0, 'sweep.tube must be an index into tubes').default(0),
      from: alphaSchema.default(0),
      to: alphaSchema.default(1),
      steps: z.number().int('steps must be a whole number').min(2, 'steps must be at least 2').max(2001, 'steps must be at most 2001').default(41),
    })
      /** Omitted: tube 0 from alpha 0 to 1 in 41 steps. */
      .prefault({}),
    levels: levelsSchema.default(6),
  })
  .refine((s) => s.sweep.tube < s.tubes.length, { error: 'sweep.tube must be an index into tubes', path: ['sweep', 'tube'] });
export type FluxSweepSpec = z.infer<typeof fluxSweepSpecSchema>;

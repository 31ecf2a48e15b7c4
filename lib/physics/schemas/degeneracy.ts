// Spec of the 'degeneracy' task: points where a moving half tube makes two levels degenerate (PHYSICS.md section 4).
// Extends the base problem; default region is the well's bounding box and default pair levels 0 and 1.
import { z } from 'zod';
import { baseProblemSchema, movingTubeSchema, regionSchema } from './common';
import { isIntegerOrHalf } from './real-flux';

const levelIndex = z.number().int('a level index must be a whole number').min(0, 'a level index must be 0 or more').max(31, 'a level index must be at most 31');

/** Why a degeneracy search is refused for these fluxes (it needs a real problem), or null. */
export const DEGENERACY_NEEDS_REAL =
  'degeneracy search needs a real problem: the moving tube and every fixed tube must have an integer or half-integer alpha';

export const degeneracySpecSchema = baseProblemSchema
  .extend({
    task: z.literal('degeneracy'),
    moving: movingTubeSchema,
    region: regionSchema.optional(),
    pair: z
      .tuple([levelIndex, levelIndex], { error: 'pair must be two level indices [lower, upper]' })
      .refine((p) => p[1] === p[0] + 1, { error: 'pair must be two neighbouring levels, e.g. [0, 1]' })
      .optional(),
  })
  .superRefine((s, ctx) => {
    if (!isIntegerOrHalf(s.moving.alpha)) {
      ctx.addIssue({ code: 'custom', path: ['moving', 'alpha'], message: DEGENERACY_NEEDS_REAL });
    }
    s.tubes.forEach((t, i) => {
      if (!isIntegerOrHalf(t.alpha)) ctx.addIssue({ code: 'custom', path: ['tubes', i, 'alpha'], message: DEGENERACY_NEEDS_REAL });
    });
  });
export type DegeneracySpec = z.infer<typeof degeneracySpecSchema>;

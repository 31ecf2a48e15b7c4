// Spec of the 'holonomy' task: the phase a level picks up when one tube is carried around a closed loop.
// Extends the base problem (PHYSICS.md section 3); the loop is rasterised by lib/physics/loop-path.ts.
import { z } from 'zod';
import { baseProblemSchema, loopSchema, movingTubeSchema } from './common';

export const holonomySpecSchema = baseProblemSchema.extend({
  task: z.literal('holonomy'),
  moving: movingTubeSchema,
  loop: loopSchema,
  /** Walking direction; default counter-clockwise for a circle and the vertex order for a polygon. */
  orientation: z.enum(['ccw', 'cw'], { error: 'orientation must be "ccw" or "cw"' }).optional(),
  level: z.number().int('level must be a whole number').min(0, 'level must be 0 or more').max(63, 'level must be at most 63').default(0),
});
export type HolonomySpec = z.infer<typeof holonomySpecSchema>;

// Spec of the 'position-sweep' task: levels versus the position of a moving tube along a path or over a region.
// Extends the base problem; exactly one of `path` (levels tracked along it) and `region` (energy landscape and force).
import { z } from 'zod';
import { baseProblemSchema, movingTubeSchema, regionSchema, vec2Schema } from './common';
import { levelsSchema } from './spectrum';

export const positionSweepSpecSchema = baseProblemSchema
  .extend({
    task: z.literal('position-sweep'),
    moving: movingTubeSchema,
    /** A polyline of tube positions; it is walked through adjacent plaquette centres. */
    path: z
      .strictObject({
        points: z.array(vec2Schema).min(2, 'a path needs at least 2 points').max(10_000, 'a path may have at most 10,000 points'),
        closed: z.boolean().optional(),
      })
      .optional(),
    /** Every plaquette centre inside this box is a tube position. */
    region: regionSchema.optional(),
    levels: levelsSchema.default(4),
  })
  .refine((s) => (s.path === undefined) !== (s.region === undefined), {
    error: 'give exactly one of path and region',
    path: ['path'],
  });
export type PositionSweepSpec = z.infer<typeof positionSweepSpecSchema>;

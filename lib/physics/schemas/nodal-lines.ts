// Spec of the 'nodal-lines' task: zero lines of a real state with half tubes (PHYSICS.md section 5).
// Extends the base problem; refuses complex problems (a nodal line of a real state needs a real Hamiltonian).
import { z } from 'zod';
import { baseProblemSchema } from './common';
import { isIntegerOrHalf } from './real-flux';

export const NODAL_LINES_NEED_REAL =
  'nodal lines need a real problem: every tube alpha must be an integer or a half-integer (other fluxes make the states complex)';

export const nodalLinesSpecSchema = baseProblemSchema
  .extend({
    task: z.literal('nodal-lines'),
    level: z.number().int('level must be a whole number').min(0, 'level must be 0 or more').max(63, 'level must be at most 63').default(0),
  })
  .superRefine((s, ctx) => {
    s.tubes.forEach((t, i) => {
      if (!isIntegerOrHalf(t.alpha)) ctx.addIssue({ code: 'custom', path: ['tubes', i, 'alpha'], message: NODAL_LINES_NEED_REAL });
    });
  });
export type NodalLinesSpec = z.infer<typeof nodalLinesSpecSchema>;

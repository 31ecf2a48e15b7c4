// Query of GET /api/snapshots/[id]/export: the format, the journal width (one column 8.6 cm, two columns 17.8 cm,
// common practice) and the display units (same names as lib/units.ts displayUnitsQuerySchema: units, L, mass).
import { z } from 'zod';

export const exportQuerySchema = z
  .object({
    format: z.enum(['svg', 'png', 'pdf', 'csv'], { error: 'format must be svg, png, pdf or csv' }),
    width: z.enum(['one', 'two'], { error: 'width must be one (8.6 cm) or two (17.8 cm)' }).default('one'),
    units: z.string().optional(),
    L: z.string().optional(),
    mass: z.string().optional(),
  })
  .strict();
export type ExportQuery = z.infer<typeof exportQuerySchema>;

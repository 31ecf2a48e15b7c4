// Zod schemas shared by every solver task spec: wells, grid, tubes, potential, regions, loops and the base problem.
// One schema per concept; forms, route handlers, the worker and the CLI all validate with these.
import { z } from 'zod';

/** A finite number with a readable message. */
const finite = () => z.number({ error: 'must be a finite number' });

/** A point [x, y] in units of L. */
export const vec2Schema = z.tuple([finite(), finite()], { error: 'must be a point [x, y] of two numbers' });
export type Vec2Spec = z.infer<typeof vec2Schema>;

const positive = (what: string) => finite().positive(`${what} must be positive`);

const angleSchema = finite().default(0);

export const diskShapeSchema = z.strictObject({ center: vec2Schema, radius: positive('radius') });
export const ellipseShapeSchema = z.strictObject({
  center: vec2Schema,
  radii: z.tuple([positive('semi-axis a'), positive('semi-axis b')], { error: 'radii must be [a, b]' }),
  /** Rotation of the first axis, degrees counter-clockwise. */
  angle: angleSchema,
});

/** An axis-aligned box {min, max}; min < max on both axes. */
export const regionSchema = z
  .strictObject({ min: vec2Schema, max: vec2Schema })
  .refine((r) => r.min[0] < r.max[0] && r.min[1] < r.max[1], {
    error: 'min must be smaller than max on both axes',
    path: ['max'],
  });
export type RegionSpec = z.infer<typeof regionSchema>;

export const rectangleShapeSchema = regionSchema;

export const polygonShapeSchema = z.strictObject({
  points: z.array(vec2Schema).min(3, 'a polygon needs at least 3 points').max(10_000, 'a polygon may have at most 10,000 points'),
});

export const annulusShapeSchema = z
  .strictObject({
    center: vec2Schema,
    radii: z.tuple([positive('inner radius'), positive('outer radius')], { error: 'radii must be [inner, outer]' }),
  })
  .refine((a) => a.radii[0] < a.radii[1], { error: 'inner radius must be smaller than outer radius', path: ['radii'] });

export const stadiumShapeSchema = z.strictObject({
  center: vec2Schema,
  /** Length of the straight part. */
  length: finite().nonnegative('length must be zero or positive'),
  radius: positive('radius'),
  angle: angleSchema,
});

export const maskShapeSchema = z.strictObject({
  /** Key of a PNG file, resolved by the caller (a path next to the spec). */
  file: z.string().min(1, 'file must name a PNG image').max(500, 'file name is too long'),
  extent: regionSchema,
  invert: z.boolean().optional(),
});

/** A well: one shape or a union / difference of wells. */
export type WellSpec =
  | { disk: z.infer<typeof diskShapeSchema> }
  | { ellipse: z.infer<typeof ellipseShapeSchema> }
  | { rectangle: z.infer<typeof rectangleShapeSchema> }
  | { polygon: z.infer<typeof polygonShapeSchema> }
  | { annulus: z.infer<typeof annulusShapeSchema> }
  | { stadium: z.infer<typeof stadiumShapeSchema> }
  | { mask: z.infer<typeof maskShapeSchema> }
  | { union: WellSpec[] }
  | { difference: [WellSpec, WellSpec] };

/** The names a well object may use as its single key. */
export const WELL_KINDS = ['disk', 'ellipse', 'rectangle', 'polygon', 'annulus', 'stadium', 'mask', 'union', 'difference'] as const;

/** The shape names of the flat form `{"shape": "disk", "center": [0, 0], "radius": 1}`. */
const SHAPE_NAMES: readonly string[] = WELL_KINDS.filter((k) => k !== 'union' && k !== 'difference');

/**
 * Accept both spellings of a shape: the flat form `{"shape":"disk","center":[0,0],"radius":1}` (the documented one)
 * and the keyed form `{"disk":{"center":[0,0],"radius":1}}` used inside Fluxfolio. The flat form is rewritten to the
 * keyed form before validation, so every later stage sees one shape.
 */
export function normalizeWellInput(input: unknown): unknown {
  if (input === null || typeof input !== 'object' || Array.isArray(input)) return input;
  const { shape, ...rest } = input as Record<string, unknown>;
  if (typeof shape !== 'string' || !SHAPE_NAMES.includes(shape)) return input;
  return { [shape]: rest };
}

export const wellSchema: z.ZodType<WellSpec, unknown> = z.lazy(() =>
  z.preprocess(normalizeWellInput, z.union(
    [
      z.strictObject({ disk: diskShapeSchema }),
      z.strictObject({ ellipse: ellipseShapeSchema }),
      z.strictObject({ rectangle: rectangleShapeSchema }),
      z.strictObject({ polygon: polygonShapeSchema }),
      z.strictObject({ annulus: annulusShapeSchema }),
      z.strictObject({ stadium: stadiumShapeSchema }),
      z.strictObject({ mask: maskShapeSchema }),
      z.strictObject({ union: z.array(wellSchema).min(1, 'a union needs at least one well').max(64, 'a union may hold at most 64 wells') }),
      z.strictObject({ difference: z.tuple([wellSchema, wellSchema], { error: 'a difference is [well, well to remove]' }) }),
    ],
    {
      error: `must be one well: {"shape": one of ${SHAPE_NAMES.join(', ')}, …its fields}, {"union": [wells]} or {"difference": [well, well]}`,
    },
  )),
) as z.ZodType<WellSpec, unknown>;

/** Grid spacing h (units of L) and an optional offset of the sites in units of h. */
export const gridSchema = z.strictObject({
  h: positive('grid spacing h').max(10, 'grid spacing h must be at most 10'),
  offset: z.tuple([finite(), finite()], { error: 'offset must be [fx, fy] in units of h' }).optional(),
});
export type GridSpec = z.infer<typeof gridSchema>;

/** Flux in units of the flux quantum h/e. */
export const alphaSchema = finite().min(-1000, 'alpha must be between -1000 and 1000').max(1000, 'alpha must be between -1000 and 1000');

/** A fixed flux tube at a point, snapped to the nearest plaquette centre. */
export const tubeSchema = z.strictObject({ at: vec2Schema, alpha: alphaSchema });
export type TubeSpec = z.infer<typeof tubeSchema>;

/** The moving tube of sweeps, loops and degeneracy scans (its position comes from the task). */
export const movingTubeSchema = z.strictObject({ alpha: alphaSchema });
export type MovingTubeSpec = z.infer<typeof movingTubeSchema>;

/** A smooth potential V(x, y) in energy units hbar^2/(2 m L^2), as a formula in x, y (see lib/physics/potential.ts). */
export const potentialSchema = z
  .string({ error: 'potential must be a formula in x and y' })
  .trim()
  .min(1, 'potential formula is empty')
  .max(500, 'potential formula is too long (at most 500 characters)');

/** A closed loop of tube positions: a circle or a polygon. */
export const loopSchema = z.union(
  [
    z.strictObject({ circle: z.strictObject({ center: vec2Schema, radius: positive('radius') }) }),
    z.strictObject({
      polygon: z.array(vec2Schema).min(3, 'a loop polygon needs at least 3 points').max(10_000, 'a loop polygon may have at most 10,000 points'),
    }),
  ],
  { error: 'loop must be {circle: {center, radius}} or {polygon: [[x, y], ...]}' },
);
export type LoopSpec = z.infer<typeof loopSchema>;

/** Eigenvalue residual tolerance, relative (see EigenOptions.tol). */
export const tolSchema = finite().positive('tol must be positive').max(1e-2, 'tol must be at most 1e-2');

/** Fields every task shares; task schemas extend this object. */
export const baseProblemSchema = z.strictObject({
  well: wellSchema,
  grid: gridSchema,
  tubes: z.array(tubeSchema).max(256, 'at most 256 tubes').default([]),
  potential: potentialSchema.optional(),
  tol: tolSchema.optional(),
});
export type BaseProblemSpec = z.infer<typeof baseProblemSchema>;
/** The base problem as written by a user (defaults not yet applied). */
export type BaseProblemInput = z.input<typeof baseProblemSchema>;

// The allow-list of components a figure note may use, each with its declared props as zod schemas of LITERAL values.
// The safe-MDX gate (remark-safe.ts) refuses every other element or prop; pages map these names to React components.
import { z } from 'zod';

/** Figure labels: the same slug rule as figure labels in the database (lower case, digits, dashes; 1-64 characters). */
export const figureLabelSchema = z
  .string()
  .min(1, 'a figure label cannot be empty')
  .max(64, 'a figure label has at most 64 characters')
  .regex(/^[a-z0-9][a-z0-9-]*$/, 'a figure label uses lower-case letters, digits and dashes (e.g. "spectral-flow")');

/** A snapshot version number: v1, v2, … */
export const snapshotVersionSchema = z.number().int('a version is a whole number').min(1, 'versions start at 1');

export const calloutKindSchema = z.enum(['note', 'warn', 'result']);

/** The props of each allowed component, as zod object schemas (strict: undeclared props are refused by the gate first). */
export const allowedComponentProps = {
  /** A live figure block: follows the figure's latest run, or the snapshot `version` when given. */
  Figure: z.object({
    label: figureLabelSchema,
    version: snapshotVersionSchema.optional(),
    height: z.number().min(120, 'height is at least 120 px').max(1200, 'height is at most 1200 px').optional(),
    caption: z.boolean().optional(),
  }),
  /** A boxed remark around its children. */
  Callout: z.object({
    kind: calloutKindSchema.default('note'),
    title: z.string().max(200, 'a title has at most 200 characters').optional(),
  }),
  /** An inline citation of a snapshot: "Fig. <label> v<version>", linking to the snapshot's stable page. */
  SnapshotRef: z.object({ label: figureLabelSchema, version: snapshotVersionSchema }),
  /** A one-line statement of the display units currently in force (dimensionless or nm / meV with m*). */
  Units: z.object({}),
} as const;

export type AllowedComponentName = keyof typeof allowedComponentProps;

/** Whether each component may wrap children (Figure, SnapshotRef and Units are self-closing). */
export const componentTakesChildren: Record<AllowedComponentName, boolean> = {
  Figure: false,
  Callout: true,
  SnapshotRef: false,
  Units: false,
};

export type FigureProps = z.infer<(typeof allowedComponentProps)['Figure']>;
export type CalloutProps = z.infer<(typeof allowedComponentProps)['Callout']>;
export type SnapshotRefProps = z.infer<(typeof allowedComponentProps)['SnapshotRef']>;

/** The allowed component names in a stable order (for editor hints and error messages). */
export const ALLOWED_COMPONENT_NAMES = Object.keys(allowedComponentProps) as AllowedComponentName[];

/** True when `name` is one of the allowed components. */
export function isAllowedComponent(name: string | null | undefined): name is AllowedComponentName {
  return typeof name === 'string' && Object.prototype.hasOwnProperty.call(allowedComponentProps, name);
}

/** The declared prop names of a component. */
export function declaredProps(name: AllowedComponentName): string[] {
  return Object.keys(allowedComponentProps[name].shape);
}

// Display units for charts and exports: the solver's dimensionless units (lengths in L, energies in ħ²/2mL²) or nanometres and
// millielectronvolts for a chosen length unit L and effective mass ratio m* / m_e. One zod schema shared by the switch and the API.
import { z } from 'zod';

/**
 * ħ²/(2 m_e) in meV·nm² for the free-electron mass: 38.0998 (CODATA 2018 values of ħ and m_e; PHYSICS.md §1).
 * The energy unit of the solver is this divided by (m* / m_e) and by L² (L in nm).
 */
export const HBAR2_OVER_2ME_MEV_NM2 = 38.0998;

/** Effective mass ratio of electrons in GaAs, the usual default for semiconductor wells (common practice). */
export const GAAS_EFFECTIVE_MASS = 0.067;

export const dimensionlessUnitsSchema = z.object({ system: z.literal('dimensionless') });

export const physicalUnitsSchema = z.object({
  system: z.literal('physical'),
  /** The length unit L in nanometres (the radius of a unit disk, the side of a unit square…). */
  lengthNm: z
    .number({ error: 'the length unit L must be a number of nanometres' })
    .positive('the length unit L must be positive (in nm)')
    .max(1e6, 'the length unit L must be at most 1,000,000 nm'),
  /** Effective mass ratio m* / m_e. */
  effectiveMass: z
    .number({ error: 'the effective mass ratio must be a number' })
    .positive('the effective mass ratio m*/mₑ must be positive')
    .max(1000, 'the effective mass ratio m*/mₑ must be at most 1000')
    .default(GAAS_EFFECTIVE_MASS),
});

/** The display-units choice: dimensionless, or nm / meV with L and m* / m_e. */
export const displayUnitsSchema = z.discriminatedUnion('system', [dimensionlessUnitsSchema, physicalUnitsSchema]);

export type DisplayUnits = z.infer<typeof displayUnitsSchema>;
export type DisplayUnitsInput = z.input<typeof displayUnitsSchema>;

export const DIMENSIONLESS: DisplayUnits = { system: 'dimensionless' };

/**
 * The same choice read from URL query parameters (`units=dimensionless`, or `units=physical&L=50&mass=0.067`), as the export
 * and chart APIs receive it. Strings are coerced to numbers; missing `units` means dimensionless.
 */
export const displayUnitsQuerySchema = z
  .object({
    units: z.enum(['dimensionless', 'physical'], { error: 'units must be "dimensionless" or "physical"' }).default('dimensionless'),
    L: z.coerce.number({ error: 'L must be a number of nanometres' }).optional(),
    mass: z.coerce.number({ error: 'mass must be a number (m*/mₑ)' }).optional(),
  })
  .transform((q, ctx): DisplayUnits => {
    if (q.units === 'dimensionless') return DIMENSIONLESS;
    const parsed = physicalUnitsSchema.safeParse({ system: 'physical', lengthNm: q.L, effectiveMass: q.mass });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path[0] === 'lengthNm' ? 'L' : issue.path[0] === 'effectiveMass' ? 'mass' : String(issue.path[0]);
        ctx.addIssue({ code: 'custom', path: [key], message: issue.message });
      }
      return z.NEVER;
    }
    return parsed.data;
  });

/**
 * Energy of one solver unit ħ²/(2 m* L²) in meV.
 *
 * @param lengthNm - L in nm
 * @param effectiveMass - m* / m_e
 * @example energyUnitMeV(10, 1) // returns 0.380998 (free electron, L = 10 nm)
 * @see PHYSICS.md §1
 */
export function energyUnitMeV(lengthNm: number, effectiveMass: number): number {
  return HBAR2_OVER_2ME_MEV_NM2 / (effectiveMass * lengthNm * lengthNm);
}

/** Factor that turns a dimensionless energy into the display unit (1 when dimensionless). */
export function energyScale(units: DisplayUnits): number {
  return units.system === 'dimensionless' ? 1 : energyUnitMeV(units.lengthNm, units.effectiveMass);
}

/** Factor that turns a length in L into the display unit (1 when dimensionless, L in nm otherwise). */
export function lengthScale(units: DisplayUnits): number {
  return units.system === 'dimensionless' ? 1 : units.lengthNm;
}

/**
 * A dimensionless energy in display units.
 * @example toDisplayEnergy(Math.PI ** 2, { system: 'physical', lengthNm: 50, effectiveMass: 0.067 }) // returns ~2.2418 (meV)
 */
export function toDisplayEnergy(energy: number, units: DisplayUnits): number {
  return energy * energyScale(units);
}

/** A display-unit energy back to the solver's units. */
export function fromDisplayEnergy(energy: number, units: DisplayUnits): number {
  return energy / energyScale(units);
}

/** A length (position) in L in display units. */
export function toDisplayLength(length: number, units: DisplayUnits): number {
  return length * lengthScale(units);
}

/** A display-unit length back to L. */
export function fromDisplayLength(length: number, units: DisplayUnits): number {
  return length / lengthScale(units);
}

/** Unit label of energies: "ħ²/2mL²" or "meV". */
export function energyUnitLabel(units: DisplayUnits): string {
  return units.system === 'dimensionless' ? 'ħ²/2mL²' : 'meV';
}

/** Unit label of lengths: "L" or "nm". */
export function lengthUnitLabel(units: DisplayUnits): string {
  return units.system === 'dimensionless' ? 'L' : 'nm';
}

/**
 * An axis title in Unicode math with its unit.
 * @example energyAxisTitle(DIMENSIONLESS) // returns 'E (ħ²/2mL²)'
 * @example energyAxisTitle(DIMENSIONLESS, 'ΔE') // returns 'ΔE (ħ²/2mL²)'
 */
export function energyAxisTitle(units: DisplayUnits, symbol = 'E'): string {
  return `${symbol} (${energyUnitLabel(units)})`;
}

/** @example lengthAxisTitle('x', { system: 'physical', lengthNm: 20, effectiveMass: 0.067 }) // returns 'x (nm)' */
export function lengthAxisTitle(symbol: string, units: DisplayUnits): string {
  return `${symbol} (${lengthUnitLabel(units)})`;
}

/** The flux axis title; flux is always in flux quanta. */
export const FLUX_AXIS_TITLE = 'α (flux quanta h/e)';

/** A one-line statement of the units in force, for notes and captions. */
export function describeUnits(units: DisplayUnits): string {
  if (units.system === 'dimensionless') return 'Lengths in L, energies in ħ²/2mL², flux in flux quanta h/e.';
  const e = energyUnitMeV(units.lengthNm, units.effectiveMass);
  return `Lengths in nm (L = ${units.lengthNm} nm), energies in meV (m*/mₑ = ${units.effectiveMass}, ħ²/2m*L² = ${e.toPrecision(4)} meV), flux in flux quanta h/e.`;
}

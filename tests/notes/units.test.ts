// Display units: the solver's dimensionless units and nm / meV with an effective mass (PHYSICS.md §1: ħ²/2m_e = 38.0998
// meV nm², CODATA), the shared zod schema for the switch, and the query-string form used by the export API.
import { describe, expect, it } from 'vitest';
import {
  describeUnits,
  DIMENSIONLESS,
  displayUnitsQuerySchema,
  displayUnitsSchema,
  energyAxisTitle,
  energyUnitMeV,
  FLUX_AXIS_TITLE,
  fromDisplayEnergy,
  lengthAxisTitle,
  toDisplayEnergy,
  toDisplayLength,
} from '@/lib/units';
import { refusalOf } from '../helpers/refusal';

const gaas50 = { system: 'physical' as const, lengthNm: 50, effectiveMass: 0.067 };

describe('units', () => {
  it('energy unit: 38.0998 meV nm² / (m*/m_e L²) (PHYSICS.md §1, CODATA)', () => {
    expect(energyUnitMeV(1, 1)).toBe(38.0998);
    expect(energyUnitMeV(10, 1)).toBeCloseTo(0.380998, 12);
    expect(energyUnitMeV(50, 0.067)).toBeCloseTo(38.0998 / (0.067 * 2500), 12);
  });

  it('converts energies and lengths both ways', () => {
    const e = toDisplayEnergy(Math.PI ** 2, gaas50);
    expect(e).toBeCloseTo((Math.PI ** 2 * 38.0998) / (0.067 * 2500), 12);
    expect(fromDisplayEnergy(e, gaas50)).toBeCloseTo(Math.PI ** 2, 12);
    expect(toDisplayLength(0.5, gaas50)).toBe(25);
    expect(toDisplayEnergy(3, DIMENSIONLESS)).toBe(3);
  });

  it('axis titles in Unicode math', () => {
    expect(energyAxisTitle(DIMENSIONLESS)).toBe('E (ħ²/2mL²)');
    expect(energyAxisTitle(gaas50)).toBe('E (meV)');
    expect(lengthAxisTitle('x', DIMENSIONLESS)).toBe('x (L)');
    expect(lengthAxisTitle('x', gaas50)).toBe('x (nm)');
    expect(FLUX_AXIS_TITLE).toBe('α (flux quanta h/e)');
  });

  it('schema: defaults the GaAs mass and refuses bad values with field messages', () => {
    expect(displayUnitsSchema.parse({ system: 'physical', lengthNm: 20 })).toEqual({ system: 'physical', lengthNm: 20, effectiveMass: 0.067 });
    const bad = displayUnitsSchema.safeParse({ system: 'physical', lengthNm: -1, effectiveMass: 0 });
    const messages = Object.fromEntries(refusalOf(bad).issues.map((i) => [i.path.join('.'), i.message]));
    expect(messages.lengthNm).toMatch(/positive/);
    expect(messages.effectiveMass).toMatch(/positive/);
    expect(displayUnitsSchema.safeParse({ system: 'imperial' }).success).toBe(false);
  });

  it('query form: units=physical&L=50&mass=0.067, errors keyed by the query names', () => {
    expect(displayUnitsQuerySchema.parse({})).toEqual(DIMENSIONLESS);
    expect(displayUnitsQuerySchema.parse({ units: 'physical', L: '50', mass: '0.067' })).toEqual(gaas50);
    const bad = displayUnitsQuerySchema.safeParse({ units: 'physical', L: '-3' });
    expect(refusalOf(bad).issues[0].path).toEqual(['L']);
    expect(displayUnitsQuerySchema.safeParse({ units: 'furlongs' }).success).toBe(false);
  });

  it('one-line statement for notes', () => {
    expect(describeUnits(DIMENSIONLESS)).toBe('Lengths in L, energies in ħ²/2mL², flux in flux quanta h/e.');
    expect(describeUnits(gaas50)).toMatch(/^Lengths in nm \(L = 50 nm\), energies in meV \(m\*\/mₑ = 0\.067, ħ²\/2m\*L² = 0\.2275 meV\)/);
  });
});

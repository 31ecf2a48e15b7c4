// Display units for the charts of a page: a context with the current choice (dimensionless or nm / meV with an
// effective mass), a switch to change it, and persistence in localStorage so the choice follows the reader.
'use client';

import { createContext, useContext, useEffect, useId, useState, type ReactNode } from 'react';
import { DIMENSIONLESS, GAAS_EFFECTIVE_MASS, displayUnitsSchema, type DisplayUnits } from '@/lib/units';

const STORAGE_KEY = 'fluxfolio.displayUnits';

interface UnitsState {
  units: DisplayUnits;
  setUnits: (units: DisplayUnits) => void;
}

const UnitsContext = createContext<UnitsState>({ units: DIMENSIONLESS, setUnits: () => {} });

/** The display units in force (dimensionless outside a provider). */
export function useDisplayUnits(): UnitsState {
  return useContext(UnitsContext);
}

/** Holds the page's display units; restores the reader's last choice after hydration. */
export function DisplayUnitsProvider({ children }: { children: ReactNode }) {
  const [units, setUnitsState] = useState<DisplayUnits>(DIMENSIONLESS);
  useEffect(() => {
    try {
      const stored = window.localStorage.getItem(STORAGE_KEY);
      if (!stored) return;
      const parsed = displayUnitsSchema.safeParse(JSON.parse(stored));
      if (parsed.success) setUnitsState(parsed.data);
    } catch {
      // An unreadable stored choice falls back to dimensionless units.
    }
  }, []);
  const setUnits = (next: DisplayUnits) => {
    setUnitsState(next);
    try {
      window.localStorage.setItem(STORAGE_KEY, JSON.stringify(next));
    } catch {
      // Private browsing may refuse storage; the choice still holds for this page.
    }
  };
  return <UnitsContext.Provider value={{ units, setUnits }}>{children}</UnitsContext.Provider>;
}

/**
 * The units switch: dimensionless (L, ħ²/2mL²) or physical (nm, meV) with the length unit L and the effective mass ratio.
 * Invalid numbers are shown inline and not applied.
 */
export function DisplayUnitsSwitch({ className }: { className?: string }) {
  const { units, setUnits } = useDisplayUnits();
  const id = useId();
  const [lengthNm, setLengthNm] = useState(units.system === 'physical' ? String(units.lengthNm) : '50');
  const [mass, setMass] = useState(units.system === 'physical' ? String(units.effectiveMass) : String(GAAS_EFFECTIVE_MASS));
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    if (units.system === 'physical') {
      setLengthNm(String(units.lengthNm));
      setMass(String(units.effectiveMass));
    }
  }, [units]);

  const apply = (system: 'dimensionless' | 'physical', l = lengthNm, m = mass) => {
    if (system === 'dimensionless') {
      setError(null);
      setUnits(DIMENSIONLESS);
      return;
    }
    const parsed = displayUnitsSchema.safeParse({ system: 'physical', lengthNm: Number(l), effectiveMass: Number(m) });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'Check the numbers');
      return;
    }
    setError(null);
    setUnits(parsed.data);
  };

  const physical = units.system === 'physical';
  return (
    <fieldset className={`flex flex-wrap items-end gap-3 text-sm ${className ?? ''}`} data-testid="units-switch">
      <legend className="sr-only">Display units</legend>
      <div className="inline-flex overflow-hidden rounded-md border border-slate-300" role="radiogroup" aria-label="Display units">
        {(['dimensionless', 'physical'] as const).map((system) => (
          <button
            key={system}
            type="button"
            role="radio"
            aria-checked={units.system === system}
            onClick={() => apply(system)}
            className={`px-3 py-1.5 focus:outline-none focus-visible:ring-2 focus-visible:ring-flux-500 ${
              units.system === system ? 'bg-flux-700 text-white' : 'bg-white text-slate-700 hover:bg-slate-50'
            }`}
          >
            {system === 'dimensionless' ? 'L, ħ²/2mL²' : 'nm, meV'}
          </button>
        ))}
      </div>
      {physical ? (
        <>
          <label className="flex flex-col" htmlFor={`${id}-l`}>
            <span className="text-xs text-slate-600">L (nm)</span>
            <input
              id={`${id}-l`}
              inputMode="decimal"
              className="w-20 rounded-md border border-slate-300 px-2 py-1"
              value={lengthNm}
              onChange={(e) => setLengthNm(e.target.value)}
              onBlur={() => apply('physical')}
            />
          </label>
          <label className="flex flex-col" htmlFor={`${id}-m`}>
            <span className="text-xs text-slate-600">m*/mₑ</span>
            <input
              id={`${id}-m`}
              inputMode="decimal"
              className="w-20 rounded-md border border-slate-300 px-2 py-1"
              value={mass}
              onChange={(e) => setMass(e.target.value)}
              onBlur={() => apply('physical')}
            />
          </label>
        </>
      ) : null}
      {error ? (
        <p role="alert" className="w-full text-xs text-red-700">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

// The Units component of figure notes: one line stating the display units in force (follows the page's switch).
// Client component: it reads the page's display-units context.
'use client';

import { describeUnits } from '@/lib/units';
import { useDisplayUnits } from '../figures/display-units';

/** A one-line statement of the current display units. */
export function UnitsLine() {
  const { units } = useDisplayUnits();
  return <p className="my-3 text-sm italic text-slate-600">{describeUnits(units)}</p>;
}

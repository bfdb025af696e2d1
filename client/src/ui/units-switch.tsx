import { useId } from 'react';
import { UNIT_SYSTEMS, useUnits, type UnitSystem } from '../lib/units';
import { cx } from '../lib/cx';

const SHORT: Record<UnitSystem, string> = { si: 'SI', us: 'US' };
const LONG: Record<UnitSystem, string> = { si: 'SI units: kN, mm, mm², MPa', us: 'US customary units: kip, in, in², ksi' };

/** Two-way switch for the unit system, as a labelled radio group (arrow keys move between). */
export function UnitsSwitch({ className }: { className?: string }) {
  const units = useUnits();
  const name = useId();
  return (
    <fieldset className={cx('flex items-center gap-2', className)}>
      <legend className="sr-only">Units</legend>
      <span aria-hidden="true" className="ledger-label">
        Units
      </span>
      <div className="flex rounded-control border border-edge">
        {UNIT_SYSTEMS.map((system) => (
          <label
            key={system}
            title={LONG[system]}
            className={cx(
              'cursor-pointer px-2 py-0.5 text-fine font-semibold has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-copper',
              units.system === system ? 'bg-ink text-white' : 'bg-card text-muted hover:text-ink',
            )}
          >
            <input
              type="radio"
              name={name}
              value={system}
              checked={units.system === system}
              onChange={() => units.setSystem(system)}
              className="sr-only"
            />
            {SHORT[system]}
            <span className="sr-only"> ({LONG[system]})</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}

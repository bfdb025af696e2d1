import { quantityOfUnit, formatNumber, useUnits, type Measure } from '../../../lib/units';
import { Figure } from '../../../ui';
import type { SheetResult } from './sheet-model';

/**
 * The working, set out as a hand calculation: each step's symbol and what it is, the
 * formula, the numbers put in, and the result with its unit and clause.
 */
export function CalcSteps({ result }: { result: SheetResult }) {
  const units = useUnits();
  const valueOf = (value: number, unit: string): Measure => {
    const q = quantityOfUnit(unit);
    if (q === 'force') return units.force(value, units.system === 'si' ? 1 : 2);
    if (q) return units[q](value, q === 'area' && units.system === 'us' ? 3 : undefined);
    const v = Number.isInteger(value) ? formatNumber(value) : Math.abs(value) < 10 ? String(Number(value.toFixed(3))) : formatNumber(value, 1);
    return { value: v, unit, text: unit ? `${v} ${unit}` : v };
  };
  return (
    <div className="flex flex-col gap-3">
      <p className="text-small text-muted">
        The numbers put into each formula are in the units the check is made in: N, mm, mm² and MPa.
        {units.system === 'us' && ' Results are also given in US customary units.'}
      </p>
      <ol className="flex flex-col divide-y divide-rule rounded-card border border-rule" aria-label="Steps of the check">
        {result.trace.map((step, i) => {
          // Written as a hand calculation: symbol = formula = numbers = result.
          const formula = step.formula.replace(new RegExp(`^\\s*${escapeRegExp(step.symbol)}\\s*=\\s*`), '');
          const result = valueOf(step.value, step.unit);
          const numbers = step.substituted && step.substituted !== formula && step.substituted !== result.value && Number(step.substituted) !== step.value ? step.substituted : null;
          const parts = [formula !== step.symbol ? formula : null, numbers].filter(Boolean);
          return (
            <li key={i} className="grid gap-x-4 gap-y-0.5 px-4 py-2 sm:grid-cols-[minmax(0,1fr)_auto]" data-step={step.symbol}>
              <div className="min-w-0">
                <p className="text-fine text-muted">{step.description}</p>
                <p className="text-small break-words">
                  <span className="font-bold">{step.symbol}</span>
                  {parts.map((p, j) => (
                    <span key={j} className="font-mono">
                      {' '}
                      <span className="text-muted">=</span> {p}
                    </span>
                  ))}{' '}
                  <span className="text-muted">=</span> <Figure measure={result} className="font-bold" />
                </p>
              </div>
              <span className="text-fine text-muted sm:text-right">{step.clause}</span>
            </li>
          );
        })}
      </ol>
    </div>
  );
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

import type { ChainTerm } from '@shared/engine/net-area/types';
import { cx } from '../../../lib/cx';
import { formatNumber, useUnits } from '../../../lib/units';
import { Figure } from '../../../ui';
import { chainHoles, type ChainView } from './sheet-model';

/**
 * The fracture chains of the governing end: the governing one first, then the next
 * ones. Pointing at or focusing a chain draws it on the plate.
 */
export function ChainList({
  chains,
  highlighted,
  onHighlight,
  thickness,
}: {
  chains: readonly ChainView[];
  highlighted: string | null;
  onHighlight: (key: string | null) => void;
  /** Plate thickness when the strip has one thickness, to state net widths. */
  thickness: number | null;
}) {
  const units = useUnits();
  const len = (mm: number) => units.length(mm, units.system === 'si' ? (Number.isInteger(mm) ? 0 : 1) : 2).text;
  const term = (t: ChainTerm) =>
    t.kind === 'hole'
      ? `hole ${t.hole + 1}: − d·t = ${len(t.d)} × ${len(t.t)} = ${units.area(t.area, units.system === 'si' ? 0 : 3).text}`
      : `holes ${t.from + 1}–${t.to + 1}: + s²·t/(4g), s ${len(t.s)}, g ${len(t.g)}, t ${len(t.t)} = ${units.area(t.area, units.system === 'si' ? 1 : 3).text}`;

  return (
    <ol className="flex flex-col gap-2" aria-label="Fracture chains">
      {chains.map((c) => {
        const on = highlighted === c.key;
        return (
          <li key={c.key}>
            <button
              type="button"
              aria-pressed={on}
              onMouseEnter={() => onHighlight(c.key)}
              onMouseLeave={() => onHighlight(null)}
              onFocus={() => onHighlight(c.key)}
              onBlur={() => onHighlight(null)}
              onClick={() => onHighlight(on ? null : c.key)}
              data-chain-item={c.key}
              className={cx(
                // Printed too: the chains are part of the working, not just a control.
                'w-full rounded-card border px-3 py-2 text-left text-small print:!block',
                c.governing ? 'border-copper' : 'border-rule',
                on ? 'bg-copper-wash' : 'bg-card hover:bg-paper',
              )}
            >
              <span className="flex flex-wrap items-baseline justify-between gap-x-3">
                <span className="font-semibold">
                  {c.governing && (
                    <svg aria-hidden="true" viewBox="0 0 24 8" className="mr-1.5 inline-block h-2 w-6 align-middle">
                      <line x1="0" y1="4" x2="24" y2="4" stroke="var(--color-copper)" strokeWidth="3" />
                    </svg>
                  )}
                  {!c.governing && (
                    <svg aria-hidden="true" viewBox="0 0 24 8" className="mr-1.5 inline-block h-2 w-6 align-middle">
                      <line x1="0" y1="4" x2="24" y2="4" stroke="var(--color-ink)" strokeWidth="2" strokeDasharray="5 3" />
                    </svg>
                  )}
                  {c.label}
                  <span className="font-normal text-muted">
                    {' '}
                    · holes {chainHoles(c.chain)}
                    {c.chain.kind === 'straight-section' ? ' · straight cut' : ''}
                  </span>
                </span>
                <span>
                  An <Figure measure={units.area(c.chain.netArea)} className="font-semibold" />
                  {thickness && (
                    <span className="text-muted">
                      {' '}
                      · net width <Figure measure={units.length(c.chain.netArea / thickness, units.system === 'si' ? 1 : 2)} />
                    </span>
                  )}
                </span>
              </span>
              <span className="mt-1 block font-mono text-fine text-muted">
                {c.chain.terms.map(term).join('; ')} → deduction {units.area(c.chain.deduction, units.system === 'si' ? 1 : 3).text}
              </span>
            </button>
          </li>
        );
      })}
      {chains.length > 1 && <li className="no-print text-fine text-muted">Point at or tab to a chain to draw it on the plate. {formatNumber(chains.length - 1)} next chains shown.</li>}
    </ol>
  );
}

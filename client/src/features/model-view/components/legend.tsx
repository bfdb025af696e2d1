import type { CSSProperties } from 'react';
import { BAND_STYLE, RESULT_BANDS, type ResultBand } from '@shared/api';
import { CONTEXT_STYLE, NOT_CHECKED_STYLE } from '../scene/member-look';

/** A band's swatch, from the same BAND_STYLE the 3D colours come from; the second cue matches the view. */
function swatch(band: ResultBand): CSSProperties {
  const colour = BAND_STYLE[band].colour;
  if (band === 'over') return { backgroundColor: colour, outline: '2px solid #1C2430', outlineOffset: '1px' };
  if (band === 'unknown') return { backgroundColor: colour, border: '2px dashed #5B6573' };
  return { backgroundColor: colour };
}

const CUE: Partial<Record<ResultBand, string>> = { over: 'outlined', unknown: 'hover for the reason' };

interface LegendProps {
  counts: Record<ResultBand, number>;
  shownBands: ReadonlySet<ResultBand>;
  onToggleBand(band: ResultBand): void;
  unchecked: { count: number; shown: boolean; onToggle(): void };
  context: { count: number; shown: boolean; onToggle(): void };
}

/** The key of the view; each line also shows or hides what it names. */
export function ModelLegend({ counts, shownBands, onToggleBand, unchecked, context }: LegendProps) {
  const row = 'flex w-full items-center gap-2 rounded-control px-1.5 py-1 text-left text-small hover:bg-ledger aria-[pressed=false]:opacity-55';
  return (
    <div className="print:[print-color-adjust:exact]">
      <p className="ledger-label mb-1">Key · press to show or hide</p>
      <ul aria-label="Result bands in the model" className="flex flex-col">
        {RESULT_BANDS.map((band) => (
          <li key={band}>
            <button type="button" className={row} aria-pressed={shownBands.has(band)} onClick={() => onToggleBand(band)} data-band={band}>
              <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={swatch(band)} />
              <span className="min-w-0 flex-1">
                <span className={band === 'over' || band === 'tight' ? 'font-semibold' : undefined}>{BAND_STYLE[band].label}</span>
                <span className="block text-fine text-muted">
                  {BAND_STYLE[band].description}
                  {CUE[band] ? ` · ${CUE[band]}` : ''}
                </span>
              </span>
              <span className="figures font-semibold">{counts[band]}</span>
            </button>
          </li>
        ))}
        <li>
          <button type="button" className={row} aria-pressed={unchecked.shown} onClick={unchecked.onToggle}>
            <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={{ backgroundColor: NOT_CHECKED_STYLE.colour, opacity: 0.45 }} />
            <span className="min-w-0 flex-1">
              {NOT_CHECKED_STYLE.label}
              <span className="block text-fine text-muted">{NOT_CHECKED_STYLE.description}</span>
            </span>
            <span className="figures font-semibold">{unchecked.count}</span>
          </button>
        </li>
        {context.count > 0 && (
          <li>
            <button type="button" className={row} aria-pressed={context.shown} onClick={context.onToggle}>
              <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={{ backgroundColor: CONTEXT_STYLE.colour, opacity: 0.3 }} />
              <span className="min-w-0 flex-1">
                {CONTEXT_STYLE.label}
                <span className="block text-fine text-muted">{CONTEXT_STYLE.description}</span>
              </span>
              <span className="figures font-semibold">{context.count}</span>
            </button>
          </li>
        )}
      </ul>
    </div>
  );
}

import type { CSSProperties } from 'react';
import { BAND_STYLE, RESULT_BANDS, type ResultBand } from '@shared/api';
import { CONTEXT_STYLE, NOT_CHECKED_STYLE } from '../scene/member-look';
import { KeyLine } from './key-line';

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
  return (
    <div className="print:[print-color-adjust:exact]">
      <p className="ledger-label mb-1">Key · press to show or hide</p>
      <ul aria-label="Result bands in the model" className="flex flex-col">
        {RESULT_BANDS.map((band) => (
          <KeyLine
            key={band}
            swatch={swatch(band)}
            label={<span className={band === 'over' || band === 'tight' ? 'font-semibold' : undefined}>{BAND_STYLE[band].label}</span>}
            description={`${BAND_STYLE[band].description}${CUE[band] ? ` · ${CUE[band]}` : ''}`}
            count={counts[band]}
            shown={shownBands.has(band)}
            onToggle={() => onToggleBand(band)}
            data={{ 'data-band': band }}
          />
        ))}
        <KeyLine swatch={{ backgroundColor: NOT_CHECKED_STYLE.colour, opacity: 0.45 }} label={NOT_CHECKED_STYLE.label} description={NOT_CHECKED_STYLE.description} count={unchecked.count} shown={unchecked.shown} onToggle={unchecked.onToggle} />
        {context.count > 0 && (
          <KeyLine swatch={{ backgroundColor: CONTEXT_STYLE.colour, opacity: 0.3 }} label={CONTEXT_STYLE.label} description={CONTEXT_STYLE.description} count={context.count} shown={context.shown} onToggle={context.onToggle} />
        )}
      </ul>
    </div>
  );
}

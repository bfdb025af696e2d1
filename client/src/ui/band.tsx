import type { CSSProperties } from 'react';
import { BAND_STYLE, RESULT_BANDS, type ResultBand } from '@shared/api';
import { cx } from '../lib/cx';
import { formatUtilisation } from '../lib/units';

/**
 * Result bands, drawn one way everywhere. Colour always comes with a second cue:
 * the band's word, hatching for `over`, a dashed outline for `unknown`, and (in
 * figures) bold type for `tight` and the word "over".
 */

/** CSS fill of a band's swatch: flat colour, hatched for over. */
export function bandFill(band: ResultBand): CSSProperties {
  const colour = BAND_STYLE[band].colour;
  if (band === 'over') {
    return { backgroundColor: colour, backgroundImage: 'repeating-linear-gradient(45deg, rgb(255 255 255 / 0.55) 0 1.5px, transparent 1.5px 5px)' };
  }
  if (band === 'unknown') return { backgroundColor: 'transparent', borderStyle: 'dashed', borderColor: colour, borderWidth: 2 };
  return { backgroundColor: colour };
}

export function BandSwatch({ band, className }: { band: ResultBand; className?: string }) {
  return (
    <span
      aria-hidden="true"
      data-band={band}
      className={cx('inline-block size-3.5 shrink-0 rounded-[2px] border border-ink/30 print:[print-color-adjust:exact]', className)}
      style={bandFill(band)}
    />
  );
}

/** Swatch and the band's word: the band as it reads in tables and lists. */
export function BandTag({ band, className }: { band: ResultBand; className?: string }) {
  return (
    <span className={cx('inline-flex items-center gap-1.5 whitespace-nowrap', className)}>
      <BandSwatch band={band} />
      <span className={cx(band === 'over' || band === 'tight' ? 'font-semibold' : undefined)}>{BAND_STYLE[band].label}</span>
    </span>
  );
}

/**
 * A utilisation figure: two decimals; bold when tight; bold with the word "over" when
 * over; a dash with the reason when there is no result.
 */
export function UtilisationFigure({ utilisation, band, missing = 'no result' }: { utilisation: number | null; band: ResultBand; missing?: string }) {
  if (utilisation == null || band === 'unknown') {
    return (
      <span className="text-muted" title={missing}>
        —<span className="sr-only"> {missing}</span>
      </span>
    );
  }
  const figure = formatUtilisation(utilisation);
  if (band === 'over') {
    return (
      <span className="font-bold whitespace-nowrap text-band-over">
        {figure} <span className="rounded-control border border-band-over px-1 text-fine tracking-wide uppercase">over</span>
      </span>
    );
  }
  return <span className={band === 'tight' ? 'font-bold text-band-tight' : undefined}>{figure}</span>;
}

/** The band key: every band with its word and range, in order. */
export function BandLegend({ counts, className }: { counts?: Partial<Record<ResultBand, number>>; className?: string }) {
  return (
    <ul aria-label="Result bands" className={cx('flex flex-wrap gap-x-5 gap-y-2 text-small', className)}>
      {RESULT_BANDS.map((band) => (
        <li key={band} className="flex items-center gap-2">
          <BandSwatch band={band} />
          <span>
            <span className="font-semibold">{BAND_STYLE[band].label}</span>
            <span className="text-muted"> · {BAND_STYLE[band].description}</span>
            {counts && <span className="figures ml-1 font-semibold">({counts[band] ?? 0})</span>}
          </span>
        </li>
      ))}
    </ul>
  );
}

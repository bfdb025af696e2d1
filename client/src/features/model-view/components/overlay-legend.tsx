import type { CSSProperties } from 'react';
import { Link } from 'react-router';
import { CONTEXT_STYLE, NOT_CHECKED_STYLE } from '../scene/member-look';
import type { MemberOverlay, OverlayEntry } from '../scene/member-overlay';
import type { OverlayView } from '../hooks/use-overlay-view';
import { KeyLine } from './key-line';

/** A key line's swatch, in the very colour the entries are painted with; outlined entries are outlined here too. */
function swatch(entry: OverlayEntry): CSSProperties {
  return entry.outlined ? { backgroundColor: entry.colour, outline: '2px solid #1C2430', outlineOffset: '1px' } : { backgroundColor: entry.colour };
}

interface OverlayLegendProps {
  view: OverlayView;
  rest: { shown: boolean; onToggle(): void };
  context: { shown: boolean; onToggle(): void };
}

/** The key of the overlay, drawn from the same entries the 3D colours come from; each line shows or hides what it names. */
export function OverlayLegend({ view, rest, context }: OverlayLegendProps) {
  const { overlay, layers } = view;
  return (
    <div className="print:[print-color-adjust:exact]" data-testid="model-view-overlay-key">
      <p className="ledger-label mb-1">{overlay.title} · press to show or hide</p>
      <ul aria-label={`Key: ${overlay.title}`} className="flex flex-col">
        {overlay.entries.map((entry, k) => (
          <KeyLine
            key={entry.id}
            swatch={swatch(entry)}
            label={<span className={entry.outlined ? 'font-semibold' : undefined}>{entry.label}</span>}
            description={`${entry.description}${entry.outlined ? ' · outlined' : ''}`}
            count={layers.counts[k]}
            shown={!view.hidden.has(k)}
            onToggle={() => view.toggle(k)}
            data={{ 'data-overlay-entry': entry.id }}
          />
        ))}
        <KeyLine swatch={{ backgroundColor: NOT_CHECKED_STYLE.colour, opacity: 0.45 }} label={overlay.rest.label} description={overlay.rest.description} count={layers.rest} shown={rest.shown} onToggle={rest.onToggle} />
        {layers.contextCount > 0 && (
          <KeyLine swatch={{ backgroundColor: CONTEXT_STYLE.colour, opacity: 0.3 }} label={CONTEXT_STYLE.label} description={CONTEXT_STYLE.description} count={layers.contextCount} shown={context.shown} onToggle={context.onToggle} />
        )}
      </ul>
      {overlay.note && <p className="mt-1 px-1.5 text-fine text-muted">{overlay.note}</p>}
    </div>
  );
}

/** The page's words about one member (hover and the picked member). */
export function OverlayWords({ words, testId }: { words: string[]; testId: string }) {
  return (
    <ul className="text-small" data-testid={testId}>
      {words.map((w) => (
        <li key={w}>{w}</li>
      ))}
    </ul>
  );
}

/** Members the overlay names that this model does not have: they cannot be drawn, so they are listed. */
export function AbsentMembers({ absent }: { absent: NonNullable<MemberOverlay['absent']> }) {
  return (
    <section aria-label={absent.title} className="rounded-card border border-dashed border-edge/60 p-3" data-testid="model-view-absent">
      <p className="ledger-label">{absent.title}</p>
      {absent.members.length === 0 ? (
        <p className="text-small text-muted">{absent.empty}</p>
      ) : (
        <ul className="mt-1 flex max-h-60 flex-col gap-1.5 overflow-y-auto text-small">
          {absent.members.map((m) => (
            <li key={m.globalId}>
              <span className="font-semibold">{m.label}</span>
              <span className="block font-mono text-fine break-all text-muted" data-global-id={m.globalId}>
                {m.href ? <Link to={m.href}>{m.globalId}</Link> : m.globalId}
              </span>
              <span className="block text-fine text-muted">{m.words.join(' · ')}</span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

import type { CSSProperties } from 'react';
import { Link } from 'react-router';
import { CONTEXT_STYLE, NOT_CHECKED_STYLE } from '../scene/member-look';
import type { MemberOverlay, OverlayEntry } from '../scene/member-overlay';
import type { OverlayView } from '../hooks/use-overlay-view';

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
  const row = 'flex w-full items-center gap-2 rounded-control px-1.5 py-1 text-left text-small hover:bg-ledger aria-[pressed=false]:opacity-55';
  return (
    <div className="print:[print-color-adjust:exact]" data-testid="model-view-overlay-key">
      <p className="ledger-label mb-1">{overlay.title} · press to show or hide</p>
      <ul aria-label={`Key: ${overlay.title}`} className="flex flex-col">
        {overlay.entries.map((entry, k) => (
          <li key={entry.id}>
            <button type="button" className={row} aria-pressed={!view.hidden.has(k)} onClick={() => view.toggle(k)} data-overlay-entry={entry.id}>
              <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={swatch(entry)} />
              <span className="min-w-0 flex-1">
                <span className={entry.outlined ? 'font-semibold' : undefined}>{entry.label}</span>
                <span className="block text-fine text-muted">
                  {entry.description}
                  {entry.outlined ? ' · outlined' : ''}
                </span>
              </span>
              <span className="figures font-semibold">{layers.counts[k]}</span>
            </button>
          </li>
        ))}
        <li>
          <button type="button" className={row} aria-pressed={rest.shown} onClick={rest.onToggle}>
            <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={{ backgroundColor: NOT_CHECKED_STYLE.colour, opacity: 0.45 }} />
            <span className="min-w-0 flex-1">
              {overlay.rest.label}
              <span className="block text-fine text-muted">{overlay.rest.description}</span>
            </span>
            <span className="figures font-semibold">{layers.rest}</span>
          </button>
        </li>
        {layers.contextCount > 0 && (
          <li>
            <button type="button" className={row} aria-pressed={context.shown} onClick={context.onToggle}>
              <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={{ backgroundColor: CONTEXT_STYLE.colour, opacity: 0.3 }} />
              <span className="min-w-0 flex-1">
                {CONTEXT_STYLE.label}
                <span className="block text-fine text-muted">{CONTEXT_STYLE.description}</span>
              </span>
              <span className="figures font-semibold">{layers.contextCount}</span>
            </button>
          </li>
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

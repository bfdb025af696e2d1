import type { OverlayChoice } from '../scene/member-overlay';

const BANDS = 'bands';
const OVERLAY = 'overlay';

/** "Colour by": result band, or the page's overlay (loaded only once chosen). */
export function ColourBy({ choice }: { choice: OverlayChoice }) {
  return (
    <div className="flex items-end gap-2">
      <label className="flex flex-col gap-0.5 text-fine text-muted">
        Colour by
        <select
          className="min-h-8 rounded-control border border-edge bg-card px-2 text-small"
          value={choice.active ? OVERLAY : BANDS}
          onChange={(e) => choice.onActiveChange(e.target.value === OVERLAY)}
        >
          <option value={BANDS}>result band</option>
          <option value={OVERLAY}>{choice.label}</option>
        </select>
      </label>
      {choice.active && !choice.overlay && !choice.error && (
        <span role="status" className="pb-1.5 text-fine text-muted">
          Loading {choice.label}…
        </span>
      )}
      {choice.active && choice.error && (
        <span role="alert" className="pb-1.5 text-fine text-fault">
          {choice.error} Members keep their result-band colours.
        </span>
      )}
    </div>
  );
}

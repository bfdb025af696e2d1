import { useEffect, useId, useState } from 'react';
import { BAND_STYLE, RESULT_BANDS, type ResultBand } from '@shared/api';
import { cx } from '../../../lib/cx';
import { BandSwatch, Button, Select, TextField } from '../../../ui';
import type { LedgerView } from '../hooks/use-ledger-params';

interface LedgerFiltersProps {
  view: LedgerView;
  onChange: (patch: Partial<LedgerView>) => void;
  classes: readonly string[];
  profiles: readonly string[];
  selectedCount: number;
  onClearSelection: () => void;
}

/** Waits until typing pauses before passing a text value on. */
function useDebounced(value: string, onSettle: (v: string) => void, ms = 300) {
  useEffect(() => {
    const timer = setTimeout(() => onSettle(value), ms);
    return () => clearTimeout(timer);
    // Only the value matters: onSettle is a new function every render.
  }, [value, ms]);
}

/** Filters of the ledger: bands, a utilisation threshold, class, profile, free text, scope and the selection. */
export function LedgerFilters({ view, onChange, classes, profiles, selectedCount, onClearSelection }: LedgerFiltersProps) {
  const [q, setQ] = useState(view.q);
  const [min, setMin] = useState(view.minUtilisation);
  const [profile, setProfile] = useState(view.profile);
  const profileList = useId();

  // Follow the address when it changes from elsewhere (Back, a link).
  useEffect(() => setQ(view.q), [view.q]);
  useEffect(() => setMin(view.minUtilisation), [view.minUtilisation]);
  useEffect(() => setProfile(view.profile), [view.profile]);

  useDebounced(q, (v) => v !== view.q && onChange({ q: v }));
  useDebounced(profile, (v) => v !== view.profile && onChange({ profile: v }), 400);
  const minInvalid = min.trim() !== '' && !(Number(min) >= 0 && Number(min) <= 100);
  useDebounced(min, (v) => !minInvalid && v !== view.minUtilisation && onChange({ minUtilisation: v }), 400);

  const toggleBand = (band: ResultBand) => {
    const on = view.bands.includes(band);
    onChange({ bands: on ? view.bands.filter((b) => b !== band) : RESULT_BANDS.filter((b) => b === band || view.bands.includes(b)) });
  };

  const anyFilter = view.bands.length > 0 || view.minUtilisation || view.ifcClass || view.profile || view.q || view.onlySelected;

  return (
    <div role="search" aria-label="Filter the members" className="flex flex-col gap-3">
      <fieldset className="flex flex-wrap items-center gap-2">
        <legend className="ledger-label mb-1.5">Bands</legend>
        {RESULT_BANDS.map((band) => {
          const on = view.bands.includes(band);
          return (
            <button
              key={band}
              type="button"
              aria-pressed={on}
              onClick={() => toggleBand(band)}
              className={cx(
                'inline-flex min-h-8 items-center gap-1.5 rounded-full border px-3 text-small font-semibold',
                on ? 'border-ink bg-ink text-white' : 'border-edge bg-card text-ink hover:bg-ledger',
              )}
            >
              <BandSwatch band={band} className={on ? 'border-white/60' : undefined} />
              {BAND_STYLE[band].label}
              {on && <span aria-hidden="true">✓</span>}
            </button>
          );
        })}
        {view.bands.length > 0 && (
          <Button variant="quiet" size="sm" onClick={() => onChange({ bands: [] })}>
            All bands
          </Button>
        )}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-[minmax(0,1.4fr)_repeat(4,minmax(0,1fr))]">
        <TextField label="Search" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="GlobalId, tag, name or profile" />
        <TextField
          label="Utilisation at least"
          inputMode="decimal"
          value={min}
          onChange={(e) => setMin(e.target.value)}
          placeholder="e.g. 0.85"
          error={minInvalid ? 'A number from 0 to 100' : undefined}
        />
        <Select
          label="Class"
          value={view.ifcClass}
          onChange={(e) => onChange({ ifcClass: e.target.value })}
          options={[{ value: '', label: 'Every class' }, ...[...new Set([...classes, ...(view.ifcClass ? [view.ifcClass] : [])])].map((c) => ({ value: c, label: c }))]}
        />
        <div>
          <TextField label="Profile" value={profile} onChange={(e) => setProfile(e.target.value)} list={profileList} placeholder="Every profile" autoComplete="off" />
          <datalist id={profileList}>
            {profiles.map((p) => (
              <option key={p} value={p} />
            ))}
          </datalist>
        </div>
        <Select
          label="Members"
          value={view.scope}
          onChange={(e) => onChange({ scope: e.target.value === 'all' ? 'all' : 'tension' })}
          options={[
            { value: 'tension', label: 'Tension members' },
            { value: 'all', label: 'Every candidate' },
          ]}
        />
      </div>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2 text-small">
        <p aria-live="polite">
          <span className="figures font-semibold">{selectedCount}</span> selected
        </p>
        <label className={cx('inline-flex items-center gap-2', selectedCount === 0 && !view.onlySelected && 'text-muted')}>
          <input
            type="checkbox"
            className="size-4 accent-copper"
            checked={view.onlySelected}
            disabled={selectedCount === 0 && !view.onlySelected}
            onChange={(e) => onChange({ onlySelected: e.target.checked })}
          />
          Show only the selected
        </label>
        {selectedCount > 0 && (
          <Button variant="quiet" size="sm" onClick={onClearSelection}>
            Clear selection
          </Button>
        )}
        {anyFilter && (
          <Button
            variant="quiet"
            size="sm"
            className="ml-auto"
            onClick={() => onChange({ bands: [], minUtilisation: '', ifcClass: '', profile: '', q: '', onlySelected: false })}
          >
            Clear filters
          </Button>
        )}
      </div>
    </div>
  );
}

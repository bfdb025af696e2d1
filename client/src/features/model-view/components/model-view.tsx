import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import * as THREE from 'three';
import { BAND_STYLE, CAUTION_SUMMARY, RESULT_BANDS, type MemberRow, type ResultBand } from '@shared/api';
import { isApiError } from '../../../lib/api-client';
import { Button, ErrorState, LoadingState } from '../../../ui';
import { useDisplayGeometry } from '../api/use-display-geometry';
import { useAllMembers } from '../api/use-all-members';
import { SceneModel } from '../scene/scene-model';
import { NOT_CHECKED_STYLE, lookOf, missingReason, type Look } from '../scene/member-look';
import { VIEWS, type ViewName } from '../scene/views';
import { ModelCanvas, type CameraRequest } from './model-canvas';
import { ModelLegend } from './legend';
import { MemberCard, UtilisationText } from './member-card';
import type { OverlayChoice } from '../scene/member-overlay';
import { useOverlayView } from '../hooks/use-overlay-view';
import { ColourBy } from './colour-by';
import { AbsentMembers, OverlayLegend, OverlayWords } from './overlay-legend';

export interface ModelViewProps {
  projectId: number;
  revisionId: number;
  /** Selected members (IFC GlobalIds), shared with the member ledger. */
  selection: ReadonlySet<string>;
  onSelectionChange(next: Set<string>): void;
  /** Height of the 3D area in CSS pixels (default 560). */
  height?: number;
  /** Another way to colour the members, offered under "Colour by" beside the result bands (composed by the page). */
  overlay?: OverlayChoice;
}

declare global {
  interface Window {
    /** Read by tests and the viewer benchmark. */
    __gaugelineView?: { drawCalls: number; firstColouredFrameMs: number; sinceMountMs: number; memberCount: number };
  }
}

/**
 * The revision in 3D: steel coloured by result band, cautions in view. Architects read
 * it at a glance; engineers pick members (shared selection with the ledger) and open
 * their sheets.
 */
export function ModelView(props: ModelViewProps) {
  const geometry = useDisplayGeometry(props.projectId, props.revisionId);
  const members = useAllMembers(props.projectId, props.revisionId);
  const height = props.height ?? 560;
  const model = useMemo(() => (geometry.data ? new SceneModel(geometry.data) : null), [geometry.data]);

  return (
    <div className="flex flex-col gap-3" data-testid="model-view">
      {geometry.isPending && (
        <div style={{ minHeight: height }} className="grid place-items-center rounded-card border border-rule bg-ledger">
          <LoadingState label="Loading the 3D view…" />
        </div>
      )}
      {geometry.isError &&
        (isApiError(geometry.error, 'geometry.unavailable') ? (
          <p className="rounded-card border border-dashed border-edge/60 px-4 py-3 text-small text-muted">
            {geometry.error.message} The member ledger below has every result.
          </p>
        ) : (
          <ErrorState title="The 3D view could not be loaded" error={geometry.error} onRetry={() => void geometry.refetch()} />
        ))}
      {model && model.entries.length === 0 && <p className="text-small text-muted">This model has no steel geometry to show.</p>}
      {model && model.entries.length > 0 && <LoadedView {...props} height={height} model={model} rows={members.data} rowsError={members.error} />}
      <p className="text-fine text-muted" data-testid="model-view-cautions">
        <span className="font-semibold text-heed">Caution · </span>
        {CAUTION_SUMMARY}
      </p>
    </div>
  );
}

type Section = 'off' | 'height' | 'north-south' | 'east-west';
const ANY = '';

function LoadedView({ projectId, revisionId, selection, onSelectionChange, height, model, rows, rowsError, overlay }: ModelViewProps & { height: number; model: SceneModel; rows: MemberRow[] | undefined; rowsError: unknown }) {
  const mountedAt = useRef(performance.now());
  const rowOf = useMemo(() => {
    const m = new Map<string, MemberRow>();
    for (const r of rows ?? []) m.set(r.globalId, r);
    return m;
  }, [rows]);
  const rowAt = useCallback((i: number) => rowOf.get(model.entries[i].globalId), [rowOf, model]);
  const looks: Look[] = useMemo(() => model.entries.map((e) => (rows ? lookOf(e, rowOf.get(e.globalId)) : e.context ? { kind: 'context' } : { kind: 'not-checked' })), [model, rows, rowOf]);

  // Paint the colour attribute from the bands (the one bandOf + BAND_STYLE pair), or from the page's overlay while it is chosen.
  const [paintVersion, setPaintVersion] = useState(0);
  const overlayColourAt = useRef<((i: number) => string | null) | null>(null);
  const [overlayPaint, setOverlayPaint] = useState(0);
  useEffect(() => {
    const palette = new Map<string, THREE.Color>();
    const colourOf = (hex: string) => palette.get(hex) ?? palette.set(hex, new THREE.Color(hex)).get(hex)!;
    model.paint((i) => {
      const look = looks[i];
      if (overlayColourAt.current) return colourOf(overlayColourAt.current(i) ?? NOT_CHECKED_STYLE.colour);
      return colourOf(look.kind === 'band' ? BAND_STYLE[look.band].colour : NOT_CHECKED_STYLE.colour);
    });
    setPaintVersion((v) => v + 1);
  }, [model, looks, overlayPaint]);

  // Filters
  const [shownBands, setShownBands] = useState<ReadonlySet<ResultBand>>(() => new Set(RESULT_BANDS));
  const [minUtil, setMinUtil] = useState<string>(ANY);
  const [ifcClass, setIfcClass] = useState(ANY);
  const [storey, setStorey] = useState(ANY);
  const [assembly, setAssembly] = useState(ANY);
  const [profile, setProfile] = useState(ANY);
  const [showContext, setShowContext] = useState(true);
  const [showUnchecked, setShowUnchecked] = useState(true);
  const [isolate, setIsolate] = useState(false);
  const [section, setSection] = useState<Section>('off');
  const [cut, setCut] = useState(50);

  const options = useMemo(() => {
    const collect = (f: (r: MemberRow) => string | null) => [...new Set((rows ?? []).map(f).filter((v): v is string => !!v))].sort((a, b) => a.localeCompare(b, 'en', { numeric: true }));
    return { classes: collect((r) => r.ifcClass), storeys: collect((r) => r.storey), assemblies: collect((r) => r.assembly), profiles: collect((r) => r.profile) };
  }, [rows]);

  const selectedIdx = useMemo(() => [...selection].map((g) => model.byGlobalId.get(g)).filter((i): i is number => i !== undefined).sort((a, b) => a - b), [selection, model]);
  const selectedSet = useMemo(() => new Set(selectedIdx), [selectedIdx]);

  const layers = useMemo(() => {
    const main: number[] = [];
    const ghost: number[] = [];
    const context: number[] = [];
    const over: number[] = [];
    const threshold = minUtil === ANY ? null : Number(minUtil);
    const counts = Object.fromEntries(RESULT_BANDS.map((b) => [b, 0])) as Record<ResultBand, number>;
    let unchecked = 0;
    let contextCount = 0;
    looks.forEach((look, i) => {
      if (look.kind === 'context') {
        contextCount++;
        if (showContext) context.push(i);
        return;
      }
      const isolatedOut = isolate && selectedIdx.length > 0 && !selectedSet.has(i);
      if (look.kind === 'not-checked') {
        unchecked++;
        if (showUnchecked && !isolatedOut) ghost.push(i);
        return;
      }
      counts[look.band]++;
      const r = rowAt(i)!;
      const passes =
        shownBands.has(look.band) &&
        (threshold === null || (r.utilisation != null && r.utilisation >= threshold)) &&
        (ifcClass === ANY || r.ifcClass === ifcClass) &&
        (storey === ANY || r.storey === storey) &&
        (assembly === ANY || r.assembly === assembly) &&
        (profile === ANY || r.profile === profile);
      if (passes && !isolatedOut) {
        main.push(i);
        if (look.band === 'over') over.push(i);
      } else if (!isolatedOut || showUnchecked) ghost.push(i);
    });
    return { main, ghost: ghost.sort((a, b) => a - b), context, over, counts, unchecked, contextCount };
  }, [looks, rowAt, shownBands, minUtil, ifcClass, storey, assembly, profile, showContext, showUnchecked, isolate, selectedIdx, selectedSet]);

  // While the page's overlay colours the view, its layers replace the band layers.
  const ov = useOverlayView({ choice: overlay, model, rowAt, filters: { minUtil, ifcClass, storey, assembly, profile }, showRest: showUnchecked, showContext, isolate, selectedSet });
  const drawn = ov?.layers ?? layers;
  useEffect(() => {
    // Repaint only when the colours change, not on every filter change (nor twice on mount).
    const next = ov ? ov.colourAt : null;
    if (overlayColourAt.current === next) return;
    overlayColourAt.current = next;
    setOverlayPaint((v) => v + 1);
  }, [ov?.colourAt]);

  const pickableFlags = useMemo(() => {
    const f = new Uint8Array(model.entries.length);
    for (const i of drawn.main) f[i] = 1;
    for (const i of drawn.ghost) f[i] = 1;
    return f;
  }, [model, drawn]);
  const pickable = useCallback((i: number) => pickableFlags[i] === 1, [pickableFlags]);

  // Section plane
  const clip = useMemo(() => {
    if (section === 'off') return null;
    const b = model.bounds;
    const f = cut / 100;
    if (section === 'height') return new THREE.Plane(new THREE.Vector3(0, -1, 0), b.min.y + (b.max.y - b.min.y) * f);
    if (section === 'north-south') return new THREE.Plane(new THREE.Vector3(0, 0, 1), -(b.min.z + (b.max.z - b.min.z) * f));
    return new THREE.Plane(new THREE.Vector3(-1, 0, 0), b.min.x + (b.max.x - b.min.x) * f);
  }, [section, cut, model]);

  // Camera
  const [camera, setCamera] = useState<CameraRequest | null>(null);
  const nonce = useRef(0);
  const look = useCallback((view: ViewName) => setCamera({ nonce: ++nonce.current, kind: 'view', view, box: model.bounds }), [model]);
  useEffect(() => look('south-east'), [look]);
  const fit = useCallback(() => {
    const ids = selectedIdx.length ? selectedIdx : drawn.main.length ? drawn.main : null;
    setCamera({ nonce: ++nonce.current, kind: 'fit', box: ids ? model.boxOf(ids) : model.bounds });
  }, [selectedIdx, drawn.main, model]);

  // Hover and picking
  const [hover, setHover] = useState<{ entry: number; x: number; y: number } | null>(null);
  const [focus, setFocus] = useState<number | null>(null);
  const wrapper = useRef<HTMLDivElement>(null);
  const onHover = useCallback((entry: number | null, x: number, y: number) => setHover(entry === null ? null : { entry, x, y }), []);
  const onPick = useCallback(
    (entry: number | null, additive: boolean) => {
      if (entry === null) {
        if (!additive) {
          setFocus(null);
          onSelectionChange(new Set());
        }
        return;
      }
      const gid = model.entries[entry].globalId;
      setFocus(entry);
      if (additive) {
        const next = new Set(selection);
        if (next.has(gid)) next.delete(gid);
        else next.add(gid);
        onSelectionChange(next);
      } else onSelectionChange(new Set([gid]));
    },
    [model, selection, onSelectionChange],
  );
  const cardEntry = focus !== null && selectedSet.has(focus) ? focus : selectedIdx.length === 1 ? selectedIdx[0] : null;

  // The next most critical member, for the keyboard and for a quick tour.
  const critical = useMemo(
    () => drawn.main.filter((i) => rowAt(i)?.utilisation != null).sort((a, b) => (rowAt(b)!.utilisation ?? 0) - (rowAt(a)!.utilisation ?? 0)),
    [drawn.main, rowAt],
  );
  const tour = useRef(-1);
  const nextCritical = useCallback(() => {
    if (!critical.length) return;
    tour.current = (tour.current + 1) % critical.length;
    const i = critical[tour.current];
    setFocus(i);
    onSelectionChange(new Set([model.entries[i].globalId]));
    setCamera({ nonce: ++nonce.current, kind: 'fit', box: model.boxOf([i]).expandByScalar(1.5) });
  }, [critical, model, onSelectionChange]);

  // First coloured frame → debug hook for tests and the benchmark.
  const onFirstColouredFrame = useCallback(
    (drawCalls: number) => {
      window.__gaugelineView = {
        drawCalls,
        firstColouredFrameMs: Math.round(performance.now()),
        sinceMountMs: Math.round(performance.now() - mountedAt.current),
        memberCount: model.entries.filter((e) => !e.context).length,
      };
    },
    [model],
  );

  const onKeyDown = (ev: KeyboardEvent<HTMLDivElement>) => {
    if (ev.target !== ev.currentTarget || ev.ctrlKey || ev.metaKey || ev.altKey) return;
    const step = Math.PI / 12;
    const view = VIEWS.find((v) => v.key === ev.key);
    const act: Record<string, () => void> = {
      ArrowLeft: () => setCamera({ nonce: ++nonce.current, kind: 'orbit', yaw: -step, pitch: 0 }),
      ArrowRight: () => setCamera({ nonce: ++nonce.current, kind: 'orbit', yaw: step, pitch: 0 }),
      ArrowUp: () => setCamera({ nonce: ++nonce.current, kind: 'orbit', yaw: 0, pitch: -step }),
      ArrowDown: () => setCamera({ nonce: ++nonce.current, kind: 'orbit', yaw: 0, pitch: step }),
      '+': () => setCamera({ nonce: ++nonce.current, kind: 'zoom', factor: 0.8 }),
      '=': () => setCamera({ nonce: ++nonce.current, kind: 'zoom', factor: 0.8 }),
      '-': () => setCamera({ nonce: ++nonce.current, kind: 'zoom', factor: 1.25 }),
      f: fit,
      i: () => setIsolate((v) => !v),
      n: nextCritical,
      Escape: () => {
        setFocus(null);
        onSelectionChange(new Set());
      },
    };
    const run = view ? () => look(view.name) : act[ev.key];
    if (run) {
      ev.preventDefault();
      run();
    }
  };

  const hoverEntry = hover ? model.entries[hover.entry] : null;
  const wrapperBox = wrapper.current?.getBoundingClientRect();
  const selectCls = 'min-h-8 rounded-control border border-edge bg-card px-2 text-small';
  const filterSelect = (label: string, value: string, set: (v: string) => void, values: string[]) => (
    <label className="flex flex-col gap-0.5 text-fine text-muted">
      {label}
      <select className={selectCls} value={value} onChange={(e) => set(e.target.value)} disabled={!values.length}>
        <option value={ANY}>any</option>
        {values.map((v) => (
          <option key={v} value={v}>
            {v}
          </option>
        ))}
      </select>
    </label>
  );

  return (
    <div className="flex flex-col gap-3">
      <div className="no-print flex flex-wrap items-end gap-x-4 gap-y-2" role="toolbar" aria-label="3D view">
        <div className="flex flex-wrap items-center gap-1.5" role="group" aria-label="Camera views">
          {VIEWS.map((v) => (
            <Button key={v.name} size="sm" variant="secondary" onClick={() => look(v.name)} title={`Key ${v.key}`}>
              {v.label}
            </Button>
          ))}
        </div>
        <div className="flex flex-wrap items-center gap-1.5">
          <Button size="sm" variant="secondary" onClick={fit} title="Key F">
            {selectedIdx.length ? 'Fit to selection' : 'Fit all'}
          </Button>
          <Button size="sm" variant="secondary" aria-pressed={isolate} onClick={() => setIsolate((v) => !v)} disabled={!selectedIdx.length && !isolate} title="Key I">
            {isolate ? 'Show all again' : 'Isolate selection'}
          </Button>
          <Button size="sm" variant="secondary" onClick={nextCritical} disabled={!critical.length} title="Key N">
            Next most critical
          </Button>
        </div>
      </div>
      <div className="no-print flex flex-wrap items-end gap-x-3 gap-y-2">
        {overlay && <ColourBy choice={overlay} />}
        <label className="flex flex-col gap-0.5 text-fine text-muted">
          Utilisation at least
          <select className={selectCls} value={minUtil} onChange={(e) => setMinUtil(e.target.value)}>
            <option value={ANY}>any</option>
            {['0.50', '0.60', '0.85', '0.90', '1.00'].map((v) => (
              <option key={v} value={v}>
                {v}
              </option>
            ))}
          </select>
        </label>
        {filterSelect('Class', ifcClass, setIfcClass, options.classes)}
        {filterSelect('Storey', storey, setStorey, options.storeys)}
        {filterSelect('Assembly', assembly, setAssembly, options.assemblies)}
        {filterSelect('Profile', profile, setProfile, options.profiles)}
        <label className="flex flex-col gap-0.5 text-fine text-muted">
          Section
          <select className={selectCls} value={section} onChange={(e) => setSection(e.target.value as Section)}>
            <option value="off">off</option>
            <option value="height">horizontal, keep below</option>
            <option value="north-south">across north–south, keep south</option>
            <option value="east-west">across east–west, keep west</option>
          </select>
        </label>
        <label className="flex flex-col gap-0.5 text-fine text-muted">
          Cut position
          <input type="range" min={0} max={100} step={1} value={cut} disabled={section === 'off'} onChange={(e) => setCut(Number(e.target.value))} className="h-8 w-40 accent-copper" aria-valuetext={`${cut} % across the model`} />
        </label>
      </div>

      <div className="flex flex-col gap-3 lg:flex-row">
        <div
          ref={wrapper}
          className="relative min-w-0 flex-1 overflow-hidden rounded-card border border-rule focus-visible:outline-2 focus-visible:outline-copper"
          style={{ height }}
          tabIndex={0}
          role="application"
          aria-label="3D model. Arrow keys turn, plus and minus zoom, 1 to 5 pick a view, F fits, I isolates, N goes to the next most critical member, Escape clears the selection."
          onKeyDown={onKeyDown}
          data-testid="model-view-canvas"
        >
          <ModelCanvas
            model={model}
            paintVersion={paintVersion}
            main={drawn.main}
            ghost={drawn.ghost}
            context={drawn.context}
            over={drawn.over}
            selected={selectedIdx}
            hover={hover?.entry ?? null}
            clip={clip}
            camera={camera}
            pickable={pickable}
            onHover={onHover}
            onPick={onPick}
            coloured={!!rows}
            onFirstColouredFrame={onFirstColouredFrame}
          />
          {!rows && !rowsError && <p className="absolute top-2 left-2 rounded-control bg-card/90 px-2 py-1 text-fine text-muted">Loading results…</p>}
          {hover && hoverEntry && wrapperBox && (
            <div
              role="tooltip"
              className="pointer-events-none absolute z-10 max-w-72 rounded-control border border-rule bg-card px-2 py-1.5 text-small shadow-sm"
              style={{ left: Math.min(hover.x - wrapperBox.left + 14, wrapperBox.width - 220), top: Math.max(4, hover.y - wrapperBox.top + 14) }}
            >
              <p className="font-semibold">
                {rowAt(hover.entry)?.tag ?? rowAt(hover.entry)?.name ?? hoverEntry.ifcClass}
                {rowAt(hover.entry)?.profile && <span className="font-normal text-muted"> · {rowAt(hover.entry)!.profile}</span>}
              </p>
              <p className="figures">
                <UtilisationText entry={hoverEntry} row={rowAt(hover.entry)} />
              </p>
              {missingReason(hoverEntry, rowAt(hover.entry)) === null ? null : <p className="text-fine text-muted">{hoverEntry.ifcClass}</p>}
              {ov && !hoverEntry.context && <OverlayWords words={ov.wordsAt(hover.entry)} testId="model-view-hover-words" />}
            </div>
          )}
        </div>
        <aside className="flex w-full shrink-0 flex-col gap-3 lg:w-72" aria-label="Key and picked member">
          {ov ? (
            <OverlayLegend view={ov} rest={{ shown: showUnchecked, onToggle: () => setShowUnchecked((v) => !v) }} context={{ shown: showContext, onToggle: () => setShowContext((v) => !v) }} />
          ) : (
            <ModelLegend
              counts={layers.counts}
              shownBands={shownBands}
              onToggleBand={(band) =>
                setShownBands((prev) => {
                  const next = new Set(prev);
                  if (next.has(band)) next.delete(band);
                  else next.add(band);
                  return next;
                })
              }
              unchecked={{ count: layers.unchecked, shown: showUnchecked, onToggle: () => setShowUnchecked((v) => !v) }}
              context={{ count: layers.contextCount, shown: showContext, onToggle: () => setShowContext((v) => !v) }}
            />
          )}
          {ov?.overlay.warnings?.map((w) => (
            <p key={w} className="text-small text-heed">
              {w}
            </p>
          ))}
          {cardEntry !== null ? (
            <>
              <MemberCard projectId={projectId} revisionId={revisionId} entry={model.entries[cardEntry]} row={rowAt(cardEntry)} />
              {ov && (
                <section aria-label={ov.overlay.title} className="rounded-card border border-rule bg-card p-3">
                  <p className="ledger-label">{ov.overlay.title}</p>
                  <OverlayWords words={ov.wordsAt(cardEntry)} testId="model-view-card-words" />
                </section>
              )}
            </>
          ) : selectedIdx.length > 1 ? (
            <p className="text-small text-muted">{selectedIdx.length} members selected. Shift-click adds or removes one.</p>
          ) : (
            <p className="text-small text-muted">Click a member for its figures; shift-click to select several.</p>
          )}
          {ov?.overlay.absent && <AbsentMembers absent={ov.overlay.absent} />}
          {rowsError ? <p className="text-small text-fault">The results could not be loaded, so members are not coloured.</p> : null}
        </aside>
      </div>
    </div>
  );
}

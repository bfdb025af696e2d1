import { useState, type ReactNode } from 'react';
import type { MemberSheet as Sheet } from '@shared/api/member-sheet';
import { developedStrip } from '@shared/engine/sections/developed-strip';
import { useUnits } from '../../../lib/units';
import { BandTag, Button, CautionsBlock, ErrorState, Figure, LoadingState, PageHeader, Panel, UtilisationFigure } from '../../../ui';
import { useMemberSheet } from '../api/use-member-sheet';
import { useMemberAudit } from '../api/use-member-audit';
import { EndDrawing } from './end-drawing';
import { ChainList } from './chain-list';
import { CalcSteps } from './calc-steps';
import { ActiveOverridesList, AssumptionsList, AuditTrail, ForcesTable, forceSourceText, ModesTable, WarningsList } from './sheet-tables';
import { OverrideForm } from './override-form';
import { assumedHoleDiameter, chainsFitEnd, chainViews, governingEndIndex, netResult } from './sheet-model';

export interface MemberSheetViewProps {
  projectId: number;
  revisionId: number;
  globalId: string;
  /** Engineers and admins may override inputs; viewers see overrides but no controls. */
  canEdit: boolean;
  /** Shown above the header, e.g. a link back to the ledger. */
  back?: ReactNode;
}

/**
 * One member, set out like a hand calculation: what it is and how it came out; the
 * bolted ends drawn with their fracture chains; the steps of the check; the capacity of
 * each mode; the forces; every assumed value and warning; overrides and their trail;
 * the cautions.
 */
export function MemberSheetView({ projectId, revisionId, globalId, canEdit, back }: MemberSheetViewProps) {
  const sheet = useMemberSheet(projectId, revisionId, globalId);
  const s = sheet.data;
  const m = s?.member;
  return (
    <>
      {back}
      <PageHeader
        eyebrow={s ? `Member sheet · ${s.revision.fileName}, revision ${s.revision.number}` : 'Member sheet'}
        title={m ? [m.tag, m.name].filter(Boolean).join(' · ') || m.globalId : sheet.isError ? 'Member unavailable' : 'Member'}
        description={
          <span className="font-mono text-small">
            GlobalId <span className="text-ink">{globalId}</span>
          </span>
        }
        actions={
          s && (
            <Button variant="secondary" onClick={() => window.print()}>
              Print this sheet
            </Button>
          )
        }
      />
      {sheet.isPending && <LoadingState label="Loading the member…" />}
      {sheet.isError && <ErrorState title="This member could not be opened" error={sheet.error} onRetry={() => void sheet.refetch()} />}
      {s && <SheetBody sheet={s} projectId={projectId} revisionId={revisionId} canEdit={canEdit} />}
    </>
  );
}

function SheetBody({ sheet, projectId, revisionId, canEdit }: { sheet: Sheet; projectId: number; revisionId: number; canEdit: boolean }) {
  const units = useUnits();
  const m = sheet.member;
  const d = sheet.detail;
  const result = sheet.result;
  const audit = useMemberAudit(projectId, revisionId, m.globalId);
  const warnings = [...new Set([...(d.warnings ?? []), ...(result?.warnings ?? [])])];

  return (
    <div className="flex flex-col gap-block">
      <Summary sheet={sheet} />

      <Panel title="Bolted ends" description="Each end drawn as the developed plate: the section unfolded along its centre-line, the member's end on the left.">
        <Ends sheet={sheet} />
      </Panel>

      <Panel title="Working" description={result ? `Check to ${(result as { standard?: string }).standard ?? sheet.revision.standard}, step by step.` : undefined}>
        {result ? <CalcSteps result={result} /> : <p className="text-muted">This member was not checked: {warnings[0] ?? 'its section could not be understood.'}</p>}
      </Panel>

      {result && (
        <Panel title="Capacities" description="Design capacity of each mode; the smallest governs.">
          <ModesTable result={result} designForceN={m.designForceN} />
        </Panel>
      )}

      <Panel
        title="Forces"
        description={
          m.designForceN != null
            ? `Design force ${units.force(m.designForceN).text}, from the ${forceSourceText(m.forceSource)}. Tension positive.`
            : 'No design force: the utilisation is unknown. Tension positive.'
        }
      >
        <ForcesTable sheet={sheet} />
      </Panel>

      <div className="grid gap-block lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:items-start">
        <Panel title="Assumed values" description="Every value not read directly from the model, with where it came from. Review each one.">
          <AssumptionsList sheet={sheet} />
        </Panel>
        <Panel title="Warnings">
          <WarningsList warnings={warnings} />
        </Panel>
      </div>

      <Panel title="Overrides" description="Inputs an engineer has changed on this member, and the trail of every change.">
        <div className="flex flex-col gap-block">
          <ActiveOverridesList overrides={d.overrides} inclusion={m.inclusion} />
          {canEdit && (
            <div className="no-print rounded-card border border-rule bg-paper px-4 py-4">
              <h3 className="mb-3 text-lead font-semibold">Change an input</h3>
              <OverrideForm sheet={sheet} projectId={projectId} revisionId={revisionId} />
            </div>
          )}
          <div>
            <h3 className="ledger-label mb-2">Trail</h3>
            {audit.isPending ? (
              <LoadingState label="Loading the trail…" />
            ) : audit.isError ? (
              <ErrorState title="The trail could not be loaded" error={audit.error} onRetry={() => void audit.refetch()} />
            ) : (
              <AuditTrail entries={audit.data} />
            )}
          </div>
        </div>
      </Panel>

      <CautionsBlock cautions={sheet.cautions} />
      <p className="text-fine text-muted">
        Engine {sheet.engineVersion ?? 'unknown'} · {sheet.revision.fileName}, revision {sheet.revision.number}
      </p>
    </div>
  );
}

function Summary({ sheet }: { sheet: Sheet }) {
  const units = useUnits();
  const m = sheet.member;
  const r = sheet.result;
  const items: { label: string; value: ReactNode }[] = [
    { label: 'Utilisation', value: <span className="text-title"><UtilisationFigure utilisation={m.utilisation} band={m.band} missing={m.designForceN == null ? 'no design force' : 'no result'} /></span> },
    { label: 'Band', value: <BandTag band={m.band} /> },
    { label: 'Design force', value: <Figure measure={m.designForceN == null ? null : units.force(m.designForceN)} missing="none" /> },
    { label: 'Design capacity', value: <Figure measure={m.designCapacityN == null ? null : units.force(m.designCapacityN)} /> },
    { label: 'Governed by', value: m.governing ?? '—' },
    { label: 'Profile', value: m.profile ?? '—' },
    {
      label: 'Grade',
      value: sheet.detail.overrides?.grade ? (
        <>
          {String(sheet.detail.overrides.grade.value)} <span className="font-normal text-muted">(override; model: {m.grade ?? 'none'})</span>
        </>
      ) : (
        (sheet.detail.steel?.grade ?? m.grade ?? '—')
      ),
    },
    { label: 'Class', value: m.ifcClass },
    { label: 'Gross area Ag', value: <Figure measure={r ? units.area(r.grossArea, units.system === 'si' ? 0 : 3) : null} /> },
    { label: 'Net area An', value: <Figure measure={r ? units.area(r.netArea, units.system === 'si' ? 0 : 3) : null} /> },
    { label: 'Length', value: <Figure measure={m.lengthMm == null ? null : units.length(m.lengthMm)} /> },
    { label: 'Storey', value: m.storey ?? '—' },
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-6 gap-y-3 rounded-card border border-rule bg-card px-5 py-4 text-small sm:grid-cols-4 xl:grid-cols-6" data-print="keep" aria-label="Result">
      {items.map((i) => (
        <div key={i.label}>
          <dt className="ledger-label">{i.label}</dt>
          <dd className="mt-0.5 font-semibold">{i.value}</dd>
        </div>
      ))}
    </dl>
  );
}

function Ends({ sheet }: { sheet: Sheet }) {
  const units = useUnits();
  const [highlighted, setHighlighted] = useState<string | null>(null);
  const d = sheet.detail;
  const section = d.profile.section;
  // An unbolted member is stored with one end that has no holes: nothing to draw there.
  const ends = d.ends.filter((e) => e.holes.length > 0);
  if (!section) return <p className="text-muted">The section &ldquo;{d.profile.name ?? 'unnamed'}&rdquo; could not be understood, so there is nothing to draw.</p>;
  if (!ends.length) return <p className="text-muted">No bolt holes were found at either end of this member. Net area equals gross area.</p>;
  const net = netResult(sheet.result);
  const gov = governingEndIndex(ends);
  const chains = chainViews(net);
  const strip = developedStrip(section);
  const thicknesses = new Set(strip.segments.map((x) => x.t));
  const thickness = thicknesses.size === 1 ? [...thicknesses][0] : null;
  const fallback = assumedHoleDiameter(sheet.result, ends.find((e) => e.boltDiameter)?.boltDiameter ?? null);

  return (
    <div className="flex flex-col gap-section">
      {ends.map((end, i) => {
        const governs = i === gov;
        const drawChains = governs && chainsFitEnd(end, d.checkInput);
        const name = end.end === 'start' ? 'Start end' : 'Far end';
        return (
          <section key={`${end.end}-${i}`} aria-label={name} className="grid gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]" data-print="keep">
            <div>
              <h3 className="mb-1 flex flex-wrap items-baseline gap-2 text-lead font-semibold">
                {name}
                {governs && <span className="rounded-control border border-copper px-1.5 text-fine font-semibold text-copper uppercase">governs</span>}
              </h3>
              <p className="mb-2 text-small text-muted">
                {end.holes.length} {end.holes.length === 1 ? 'hole' : 'holes'}
                {end.boltDiameter ? `, bolts ⌀ ${units.length(end.boltDiameter, units.system === 'si' ? 0 : 3).text}` : ''}
                {end.boltGrade ? ` grade ${end.boltGrade}` : ''}
                {end.governing ? ` · this end is governed by ${end.governing}` : ''}
              </p>
              <EndDrawing
                section={section}
                end={end}
                fallbackHoleDiameter={fallback}
                chains={drawChains ? chains : []}
                highlighted={drawChains ? highlighted : null}
                band={sheet.member.band}
                title={`${name} of ${sheet.member.tag ?? sheet.member.globalId}, developed plate`}
              />
            </div>
            <div>
              {drawChains && chains.length > 0 ? (
                <>
                  <h4 className="ledger-label mb-2">Fracture chains (Cochrane, s²/4g)</h4>
                  <ChainList chains={chains} highlighted={highlighted} onHighlight={setHighlighted} thickness={thickness} />
                </>
              ) : (
                <p className="text-small text-muted">
                  {governs ? 'The chains could not be matched to the holes drawn.' : 'The net section is worked for the governing end; this end has no smaller capacity.'}
                </p>
              )}
            </div>
          </section>
        );
      })}
      <Legend />
    </div>
  );
}

function Legend() {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-fine text-muted" aria-label="Drawing key">
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" viewBox="0 0 24 8" className="h-2 w-6"><line x1="0" y1="4" x2="24" y2="4" stroke="var(--color-copper)" strokeWidth="3" /></svg>
        governing chain
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" viewBox="0 0 24 8" className="h-2 w-6"><line x1="0" y1="4" x2="24" y2="4" stroke="var(--color-ink)" strokeWidth="2" strokeDasharray="5 3" /></svg>
        another chain (while pointed at)
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" viewBox="0 0 24 8" className="h-2 w-6"><line x1="0" y1="4" x2="24" y2="4" stroke="var(--color-copper)" strokeOpacity="0.55" strokeDasharray="6 4" /></svg>
        gauge line
      </li>
      <li>e end distance · p pitch · s stagger · g gauge · edge edge distance</li>
      <li>hatched plate: over</li>
    </ul>
  );
}

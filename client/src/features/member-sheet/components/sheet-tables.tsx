import type { MemberSheet } from '@shared/api/member-sheet';
import type { ActiveOverrides, MemberAuditEntry, OverrideField } from '@shared/api';
import { formatDateTime } from '../../../lib/format';
import { formatUtilisation, useUnits, type Units } from '../../../lib/units';
import { Badge, EmptyState, Figure, Notice, RowHeader, Table, TBody, Td, Th, THead, Tr } from '../../../ui';
import type { SheetResult } from './sheet-model';

/** Capacity of every mode checked; the governing one is marked in words, not only in weight. */
export function ModesTable({ result, designForceN }: { result: SheetResult; designForceN: number | null }) {
  const units = useUnits();
  return (
    <Table caption="Capacity of each mode">
      <THead>
        <tr>
          <Th>Mode</Th>
          <Th numeric>Design capacity</Th>
          <Th numeric>Force ÷ capacity</Th>
          <Th>Clause</Th>
        </tr>
      </THead>
      <TBody>
        {result.modes.map((mode) => {
          const governs = mode.name === result.governing;
          return (
            <Tr key={mode.name} className={governs ? 'bg-copper-wash' : undefined}>
              <RowHeader className={governs ? 'font-bold' : 'font-normal'}>
                {mode.name} {governs && <Badge tone="copper">governs</Badge>}
              </RowHeader>
              <Td numeric className={governs ? 'font-bold' : undefined}>
                <Figure measure={units.force(mode.capacity)} />
              </Td>
              <Td numeric>{designForceN != null && mode.capacity > 0 ? formatUtilisation(designForceN / mode.capacity) : <span className="text-muted">—</span>}</Td>
              <Td className="text-muted">{mode.clause}</Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}

/** Every value the check assumed or took from somewhere other than the model's own numbers, with its source. */
export function AssumptionsList({ sheet }: { sheet: MemberSheet }) {
  const units = useUnits();
  const steel = sheet.detail.steel;
  const assumptions = sheet.result?.assumptions ?? [];
  return (
    <div className="flex flex-col gap-3">
      {steel && (
        <p className="text-small">
          Steel used: <strong>{steel.grade}</strong>, fy <Figure measure={units.stress(steel.fy)} />, fu <Figure measure={units.stress(steel.fu)} /> —{' '}
          <span className="text-muted">{steel.source}</span>
          {steel.fromDefault && (
            <>
              {' '}
              <Badge tone="fault">project default grade</Badge>
            </>
          )}
        </p>
      )}
      {assumptions.length === 0 ? (
        <p className="text-small text-muted">The check made no assumptions.</p>
      ) : (
        <Table caption="Assumed values and their sources">
          <THead>
            <tr>
              <Th>Value</Th>
              <Th numeric>Taken as</Th>
              <Th>Source</Th>
            </tr>
          </THead>
          <TBody>
            {assumptions.map((a, i) => (
              <Tr key={`${a.name}-${i}`}>
                <RowHeader>{a.name}</RowHeader>
                <Td numeric className="font-semibold">
                  {assumedValue(a.name, a.value, units)}
                </Td>
                <Td className="text-muted">{a.source}</Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}

/** Assumed values with a known quantity read in the person's units. */
function assumedValue(name: string, value: string | number, units: Units): string {
  const n = typeof value === 'number' ? value : Number(value);
  if (!Number.isFinite(n) || String(value).trim() === '') return String(value);
  if (name === 'fy' || name === 'fu') return units.stress(n).text;
  if (name === 'Ag' || name === 'An') return units.area(n, units.system === 'si' ? 0 : 3).text;
  if (/diameter|length|x̄|distance|gauge|pitch/i.test(name)) return units.length(n, units.system === 'si' ? (Number.isInteger(n) ? 0 : 1) : 2).text;
  return String(value);
}

export function WarningsList({ warnings }: { warnings: readonly string[] }) {
  if (!warnings.length) return <p className="text-small text-muted">No warnings for this member.</p>;
  return (
    <Notice tone="caution" title={`${warnings.length} ${warnings.length === 1 ? 'warning' : 'warnings'}`}>
      <ul className="list-disc pl-5">
        {warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    </Notice>
  );
}

const FORCE_SOURCES: Record<string, string> = {
  'property-set': 'property set in the model',
  'analysis-model': 'structural analysis model in the file',
  'forces-csv': 'forces file',
  override: 'engineer’s override',
};
export const forceSourceText = (source: string | null) => (source ? (FORCE_SOURCES[source] ?? source) : 'none');

/** Axial force per load case, tension positive, with where each came from. */
export function ForcesTable({ sheet }: { sheet: MemberSheet }) {
  const units = useUnits();
  const design = sheet.member.designForceN;
  if (!sheet.forces.length) {
    return (
      <EmptyState title="No forces for this member">
        {design != null ? (
          <>
            Design force <Figure measure={units.force(design)} /> from the {forceSourceText(sheet.member.forceSource)}.
          </>
        ) : (
          'Without a design force there is no utilisation. Apply a forces file to the revision, or set the design force as an override.'
        )}
      </EmptyState>
    );
  }
  return (
    <Table caption="Axial force per load case (tension positive)">
      <THead>
        <tr>
          <Th>Load case</Th>
          <Th numeric>Axial force</Th>
          <Th>From</Th>
        </tr>
      </THead>
      <TBody>
        {sheet.forces.map((f, i) => {
          const isDesign = design != null && Math.abs(f.axialN - design) < 0.5;
          return (
            <Tr key={`${f.loadCase}-${i}`} className={isDesign ? 'bg-copper-wash' : undefined}>
              <RowHeader className={isDesign ? 'font-bold' : 'font-normal'}>
                {f.loadCase} {isDesign && <Badge tone="copper">design</Badge>}
              </RowHeader>
              <Td numeric>
                <Figure measure={units.force(f.axialN)} />
                {f.axialN < 0 && <span className="ml-1 text-fine text-muted">compression</span>}
              </Td>
              <Td className="text-muted">{forceSourceText(f.source)}</Td>
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}

export const OVERRIDE_LABELS: Record<OverrideField | 'inclusion', string> = {
  grade: 'Steel grade',
  fy: 'fy',
  fu: 'fu',
  kt: 'kt',
  U: 'U',
  holeDiameter: 'Hole diameter',
  designForceN: 'Design force',
  inclusion: 'Included in the check',
};

/** An override's value as read: with its unit where it has one. */
export function overrideValueText(field: string, value: unknown, units: Units): string {
  if (value === null || value === undefined) return 'none';
  const n = typeof value === 'number' ? value : NaN;
  if (Number.isFinite(n)) {
    if (field === 'fy' || field === 'fu') return units.stress(n).text;
    if (field === 'holeDiameter') return units.length(n, units.system === 'si' ? 1 : 3).text;
    if (field === 'designForceN') return units.force(n).text;
  }
  if (field === 'inclusion') return value === 'auto' ? 'as found' : String(value);
  return String(value);
}

/** Overrides in force on this member: what, by whom, when and why. */
export function ActiveOverridesList({ overrides, inclusion }: { overrides: ActiveOverrides | undefined; inclusion: string }) {
  const units = useUnits();
  const entries = Object.entries(overrides ?? {}) as [OverrideField, NonNullable<ActiveOverrides[OverrideField]>][];
  if (!entries.length && inclusion === 'auto') return <p className="text-small text-muted">No overrides: every input is as read from the model or assumed above.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label="Overrides in force">
      {inclusion !== 'auto' && (
        <li className="rounded-card border border-l-4 border-rule border-l-copper px-3 py-2 text-small">
          <strong>{OVERRIDE_LABELS.inclusion}:</strong> {inclusion === 'included' ? 'included by hand' : 'excluded by hand'}
        </li>
      )}
      {entries.map(([field, o]) => (
        <li key={field} className="rounded-card border border-l-4 border-rule border-l-copper px-3 py-2 text-small" data-override={field}>
          <p>
            <strong>{OVERRIDE_LABELS[field]}</strong> set to <strong className="figures">{overrideValueText(field, o.value, units)}</strong>
          </p>
          <p className="text-muted">
            by {o.by}, <time dateTime={o.at}>{formatDateTime(o.at)}</time>
          </p>
          <p className="mt-0.5">“{o.reason}”</p>
        </li>
      ))}
    </ul>
  );
}

/** The member's audit trail, newest first. */
export function AuditTrail({ entries }: { entries: readonly MemberAuditEntry[] }) {
  const units = useUnits();
  if (!entries.length) return <p className="text-small text-muted">Nothing has been changed on this member.</p>;
  return (
    <Table caption="Changes to this member, newest first">
      <THead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>Change</Th>
          <Th>Reason</Th>
        </tr>
      </THead>
      <TBody>
        {entries.map((e, i) => (
          <Tr key={`${e.at}-${i}`}>
            <Td className="whitespace-nowrap">
              <time dateTime={e.at}>{formatDateTime(e.at)}</time>
            </Td>
            <Td>{e.by ?? 'Gaugeline'}</Td>
            <Td>
              <ul>
                {Object.entries(e.change).map(([field, c]) => (
                  <li key={field}>
                    <span className="font-semibold">{OVERRIDE_LABELS[field as OverrideField] ?? field}</span>: {overrideValueText(field, c.before, units)} →{' '}
                    {overrideValueText(field, c.after, units)}
                  </li>
                ))}
                {Object.keys(e.change).length === 0 && <li className="text-muted">{e.action}</li>}
              </ul>
            </Td>
            <Td>{e.reason ?? <span className="text-muted">—</span>}</Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}

import { useCallback, useState } from 'react';
import { BAND_STYLE, memberOverrideRequestSchema, type ActiveOverrides, type MemberRow, type OverrideField } from '@shared/api';
import type { MemberSheet } from '@shared/api/member-sheet';
import { useZodForm, type FieldErrors } from '../../../lib/form';
import { formatUtilisation, useUnits, type Quantity } from '../../../lib/units';
import { Button, Notice, Select, TextField } from '../../../ui';
import { useOverrideMember } from '../api/use-override-member';
import { OVERRIDE_LABELS } from './sheet-tables';

type Field = 'grade' | 'fy' | 'fu' | 'kt' | 'U' | 'holeDiameter' | 'designForceN' | 'inclusion' | 'reason' | 'remove';
const INITIAL: Record<Field, string> = { grade: '', fy: '', fu: '', kt: '', U: '', holeDiameter: '', designForceN: '', inclusion: '', reason: '', remove: '' };
const NUMERIC: Partial<Record<Field, Quantity | null>> = { fy: 'stress', fu: 'stress', kt: null, U: null, holeDiameter: 'length', designForceN: 'force' };

/** Removable overrides: fy and fu go together. */
const REMOVABLE: { id: string; fields: OverrideField[] }[] = [
  { id: 'grade', fields: ['grade'] },
  { id: 'fy', fields: ['fy', 'fu'] },
  { id: 'kt', fields: ['kt'] },
  { id: 'U', fields: ['U'] },
  { id: 'holeDiameter', fields: ['holeDiameter'] },
  { id: 'designForceN', fields: ['designForceN'] },
];

const assumption = (sheet: MemberSheet, name: string) => sheet.result?.assumptions.find((a) => a.name === name)?.value;

/**
 * The engineer's override form: change any input of the check, or take an override
 * away, with a reason (always). The member is checked again by the server at once.
 * Values are typed in the person's units and sent in N, mm and MPa.
 */
export function OverrideForm({ sheet, projectId, revisionId }: { sheet: MemberSheet; projectId: number; revisionId: number }) {
  const units = useUnits();
  const member = sheet.member;
  const override = useOverrideMember(projectId, revisionId, member.globalId);
  const [saved, setSaved] = useState<MemberRow | null>(null);
  const active: ActiveOverrides = sheet.detail.overrides ?? {};

  const prepare = useCallback(
    (v: Record<Field, string>) => {
      const out: Record<string, unknown> = { reason: v.reason };
      if (v.grade.trim()) out.grade = v.grade.trim();
      for (const [field, q] of Object.entries(NUMERIC) as [Field, Quantity | null][]) {
        const text = v[field].trim().replace(',', '.');
        if (!text) continue;
        const n = Number(text);
        out[field] = Number.isFinite(n) && q ? units.toSI(q, n) : n;
      }
      if (v.inclusion) out.inclusion = v.inclusion;
      for (const id of v.remove.split(',').filter(Boolean)) {
        for (const f of REMOVABLE.find((r) => r.id === id)?.fields ?? []) out[f] = null;
      }
      return out;
    },
    [units],
  );

  const check = useCallback((v: Record<Field, string>) => {
    const errors: FieldErrors<Field> = {};
    for (const field of Object.keys(NUMERIC) as Field[]) {
      const text = v[field].trim().replace(',', '.');
      if (text && !Number.isFinite(Number(text))) errors[field] = 'Enter a number';
    }
    return errors;
  }, []);

  const form = useZodForm({ initial: INITIAL, schema: memberOverrideRequestSchema, prepare, check });
  const removing = new Set(form.values.remove.split(',').filter(Boolean));
  const toggleRemove = (id: string, on: boolean) => {
    const next = new Set(removing);
    if (on) next.add(id);
    else next.delete(id);
    form.setValue('remove', [...next].join(','));
  };

  const steel = sheet.detail.steel;
  const placeholder = (value: unknown) => (value === undefined || value === null || value === '' ? undefined : `now ${value}`);
  const fmt = (q: Quantity, si: number | undefined | null, decimals?: number) => (si == null ? undefined : units[q](si, decimals).text);
  const removable = REMOVABLE.filter((r) => r.fields.some((f) => active[f]));

  return (
    <form
      aria-label="Override inputs"
      {...form.formProps(async (request) => {
        setSaved(null);
        const row = await override.mutateAsync(request);
        setSaved(row);
        form.reset();
      })}
      className="flex flex-col gap-4"
    >
      {form.formError && (
        <Notice ref={form.noticeRef} tone="error" title="The override was not saved">
          {form.formError}
        </Notice>
      )}
      {saved && (
        <Notice tone="success" title="Override saved">
          {saved.tag ?? saved.globalId} was checked again:{' '}
          {saved.utilisation == null ? (
            'no utilisation (no design force or missing input)'
          ) : (
            <>
              utilisation <strong>{formatUtilisation(saved.utilisation)}</strong> ({BAND_STYLE[saved.band].label})
            </>
          )}
          .
        </Notice>
      )}
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="ledger-label mb-2">Steel</legend>
        <TextField label="Grade" {...form.field('grade')} optional placeholder={placeholder(steel?.grade)} description="A grade name Gaugeline knows, e.g. S355J2." />
        <TextField label={`fy (${units.unitOf('stress')})`} {...form.field('fy')} optional inputMode="decimal" placeholder={placeholder(fmt('stress', steel?.fy))} />
        <TextField label={`fu (${units.unitOf('stress')})`} {...form.field('fu')} optional inputMode="decimal" placeholder={placeholder(fmt('stress', steel?.fu))} description="Give fy and fu together." />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="ledger-label mb-2">Check inputs</legend>
        <TextField label="kt" {...form.field('kt')} optional inputMode="decimal" placeholder={placeholder(assumption(sheet, 'kt'))} description="Correction factor for distribution (AS 4100)." />
        <TextField label="U" {...form.field('U')} optional inputMode="decimal" placeholder={placeholder(assumption(sheet, 'U'))} description="Shear-lag factor (AISC 360)." />
        <TextField
          label={`Hole diameter (${units.unitOf('length')})`}
          {...form.field('holeDiameter')}
          optional
          inputMode="decimal"
          placeholder={placeholder(fmt('length', Number(assumption(sheet, 'hole diameter')) || null, units.system === 'si' ? 0 : 3))}
        />
      </fieldset>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="ledger-label mb-2">Action</legend>
        <TextField
          label={`Design force (${units.unitOf('force')})`}
          {...form.field('designForceN')}
          optional
          inputMode="decimal"
          placeholder={placeholder(fmt('force', member.designForceN))}
          description="Tension positive."
        />
        <Select
          label="Included in the check"
          {...form.field('inclusion')}
          optional
          options={[
            { value: '', label: 'Leave as it is' },
            { value: 'auto', label: 'As found (tension members)' },
            { value: 'included', label: 'Include' },
            { value: 'excluded', label: 'Leave out' },
          ]}
        />
      </fieldset>
      {removable.length > 0 && (
        <fieldset className="flex flex-col gap-1.5">
          <legend className="ledger-label mb-1">Take away overrides</legend>
          {removable.map((r) => (
            <label key={r.id} className="inline-flex items-center gap-2 text-small">
              <input type="checkbox" className="size-4 accent-copper" checked={removing.has(r.id)} onChange={(e) => toggleRemove(r.id, e.target.checked)} />
              {r.fields.map((f) => OVERRIDE_LABELS[f]).join(' and ')} (back to the model’s value)
            </label>
          ))}
        </fieldset>
      )}
      <TextField label="Reason" multiline rows={2} {...form.field('reason')} description="Why the change is right: it is kept with the member and shown on its sheet." />
      <div>
        <Button type="submit" busy={override.isPending}>
          Save and check again
        </Button>
      </div>
    </form>
  );
}

import { useMemo, useState } from 'react';
import { sendCriticalRequestSchema } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { ROLE_LABELS } from '../../../lib/roles';
import { Button, Checkbox, ChoiceGroup, ErrorState, LoadingState, Notice, TextField } from '../../../ui';
import { useProjectPeople, useSendCritical, type SendCriticalAnswer } from '../api/use-send-critical';

const DEFAULT_THRESHOLD = '0.85';
const initial = { people: '', recipients: '', message: '', attach: 'csv,pdf', minUtilisation: DEFAULT_THRESHOLD };
type Field = keyof typeof initial;

/** Addresses typed one per line or separated by commas or semicolons. */
const splitList = (text: string) =>
  text
    .split(/[\n,;]+/)
    .map((s) => s.trim())
    .filter(Boolean);

const THRESHOLD = /^\d*\.?\d+$/;
const thresholdOk = (text: string) => THRESHOLD.test(text.trim()) && Number(text) <= 100;

function prepare(v: Record<Field, string>) {
  const recipients = [...new Set([...splitList(v.people), ...splitList(v.recipients)])];
  return {
    recipients,
    message: v.message,
    attach: splitList(v.attach),
    // An unreadable threshold is reported by `check`, in plain words.
    minUtilisation: thresholdOk(v.minUtilisation) ? Number(v.minUtilisation) : undefined,
  };
}

function check(v: Record<Field, string>) {
  const errors: Partial<Record<Field, string>> = {};
  if (!thresholdOk(v.minUtilisation)) errors.minUtilisation = 'Enter a utilisation such as 0.85 (0 sends every checked member)';
  return errors;
}

interface SendCriticalFormProps {
  projectId: number;
  revisionId: number;
  revisionNumber: number;
  /** The signed-in person: listed first among the project's people, marked "(you)", not ticked. */
  currentUserEmail: string;
  onDone: () => void;
}

/**
 * Sends the revision's critical members by e-mail: recipients ticked from the project's
 * people and/or typed, a covering note, the CSV and/or PDF, and the utilisation from
 * which a member counts as critical. A refusal keeps everything typed.
 */
export function SendCriticalForm({ projectId, revisionId, revisionNumber, currentUserEmail, onDone }: SendCriticalFormProps) {
  const people = useProjectPeople(projectId);
  const send = useSendCritical();
  const [answer, setAnswer] = useState<SendCriticalAnswer | null>(null);
  const form = useZodForm({ initial, schema: sendCriticalRequestSchema, prepare, check });

  const ticked = useMemo(() => new Set(splitList(form.values.people)), [form.values.people]);
  const attach = useMemo(() => new Set(splitList(form.values.attach)), [form.values.attach]);
  const toggle = (name: 'people' | 'attach', current: Set<string>, value: string, on: boolean) => {
    const next = new Set(current);
    if (on) next.add(value);
    else next.delete(value);
    form.setValue(name, [...next].join(','));
  };

  const submit = form.formProps(async (request) => {
    setAnswer(await send.mutateAsync({ projectId, revisionId, request }));
  });

  if (answer) {
    return (
      <div className="flex flex-col gap-4">
        <Notice tone="success" title="Message queued">
          {answer.message}
        </Notice>
        <div className="flex flex-wrap gap-2">
          <Button data-autofocus onClick={onDone}>
            Done
          </Button>
          <Button variant="secondary" onClick={() => setAnswer(null)}>
            Send to someone else
          </Button>
        </div>
      </div>
    );
  }

  const attachField = form.field('attach');
  const others = (people.data ?? []).filter((p) => p.email !== currentUserEmail);
  const me = (people.data ?? []).find((p) => p.email === currentUserEmail);
  const listed = me ? [me, ...others] : others;

  return (
    <form {...submit} aria-label="Send critical members" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Not sent">
          {form.formError}
        </Notice>
      )}
      <div className="grid items-start gap-5 md:grid-cols-2">
        <ChoiceGroup legend="People on this project" optional description="Tick whoever should get the list.">
          {people.isPending && <LoadingState label="Loading the project's people…" />}
          {people.isError && <ErrorState title="The project's people could not be loaded" error={people.error} onRetry={() => void people.refetch()} />}
          {people.data && listed.length === 0 && <p className="text-small text-muted">Nobody else is on this project; type addresses instead.</p>}
          {listed.map((p, i) => (
            <Checkbox
              key={p.userId}
              name="people"
              value={p.email}
              checked={ticked.has(p.email)}
              onChange={(e) => toggle('people', ticked, p.email, e.target.checked)}
              data-autofocus={i === 0 ? true : undefined}
              label={
                <>
                  {p.name}
                  {p.email === currentUserEmail && <span className="text-muted"> (you)</span>}
                  <span className="text-muted"> · {ROLE_LABELS[p.role]}</span>
                </>
              }
              hint={p.email}
            />
          ))}
        </ChoiceGroup>
        <TextField
          label="Other addresses"
          optional
          multiline
          rows={3}
          spellCheck={false}
          autoCapitalize="none"
          description="One per line, or separated by commas. For people outside Gaugeline, such as a fabricator or the site team."
          data-autofocus={people.data && listed.length === 0 ? true : undefined}
          {...form.field('recipients')}
        />
      </div>
      <TextField label="Message" optional multiline rows={3} description="Goes at the top of the e-mail, above the list and the cautions." {...form.field('message')} />
      <div className="grid items-start gap-5 md:grid-cols-2">
        <ChoiceGroup legend="Attach" error={attachField.error}>
          <Checkbox
            name="attach"
            value="csv"
            checked={attach.has('csv')}
            onChange={(e) => toggle('attach', attach, 'csv', e.target.checked)}
            ref={attachField.ref as (el: HTMLInputElement | null) => void}
            label="CSV table"
            hint="One row per member, for spreadsheets"
          />
          <Checkbox name="attach" value="pdf" checked={attach.has('pdf')} onChange={(e) => toggle('attach', attach, 'pdf', e.target.checked)} label="PDF report" hint="The list with the cautions, ready to print" />
        </ChoiceGroup>
        <TextField
          label="Members from utilisation"
          inputMode="decimal"
          autoComplete="off"
          description={`Members at or above this utilisation are sent. ${DEFAULT_THRESHOLD} sends the tight and over ones.`}
          className="max-w-xs"
          {...form.field('minUtilisation')}
        />
      </div>
      <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-4">
        <Button type="submit" busy={send.isPending}>
          {send.isPending ? 'Sending…' : `Send revision ${revisionNumber}'s critical members`}
        </Button>
        <Button variant="secondary" onClick={onDone} disabled={send.isPending}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

import { useState } from 'react';
import { Link } from 'react-router';
import { MAIL_STATUSES, type OutboxEntry } from '@shared/api';
import { errorMessage } from '../../../lib/api-client';
import { formatCount, formatDateTime } from '../../../lib/format';
import { Badge, Button, EmptyState, ErrorState, LoadingState, Notice, RowHeader, Select, Table, TBody, Td, Th, THead, Tr } from '../../../ui';
import { useOutbox, useRetryMail } from '../api/use-outbox';
import { canRetry, kindLabel, STATUS_TONES, statusLabel } from './mail-words';

type Outcome = { tone: 'success' | 'error'; text: string } | null;
const ALL = '';
const filterOptions = [{ value: ALL, label: 'Every message' }, ...MAIL_STATUSES.map((s) => ({ value: s, label: statusLabel(s) }))];

/**
 * Every message Gaugeline has sent or will send, newest first: who it is for, what it
 * is, how far it got, and the mail service's last complaint. Waiting and given-up
 * messages can be sent again by hand.
 */
export function OutboxList({ messageHref }: { messageHref: (mailId: number) => string }) {
  const outbox = useOutbox();
  const retry = useRetryMail();
  const [status, setStatus] = useState(ALL);
  const [outcome, setOutcome] = useState<Outcome>(null);

  const tryAgain = (m: OutboxEntry) => {
    setOutcome(null);
    retry.mutate(m.id, {
      onSuccess: (after) => setOutcome({ tone: 'success', text: `“${m.subject}”: ${statusLabel(after.status).toLowerCase()}.` }),
      onError: (error) => setOutcome({ tone: 'error', text: `“${m.subject}”: ${errorMessage(error)}` }),
    });
  };

  if (outbox.isPending) return <LoadingState label="Loading the outbox…" />;
  if (outbox.isError) return <ErrorState title="The outbox could not be loaded" error={outbox.error} onRetry={() => void outbox.refetch()} />;
  if (outbox.data.length === 0) return <EmptyState title="No mail yet">Invitations, password links, import notices and critical-member lists appear here as Gaugeline sends them.</EmptyState>;

  const shown = status === ALL ? outbox.data : outbox.data.filter((m) => m.status === status);
  const stuck = outbox.data.filter(canRetry).length;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <Select label="Show" options={filterOptions} value={status} onChange={(e) => setStatus(e.target.value)} className="w-80 max-w-full" />
        <p className="text-small text-muted" aria-live="polite">
          {stuck > 0 ? `${formatCount(stuck)} not delivered yet.` : 'Nothing is stuck.'}
        </p>
      </div>
      <div aria-live="polite">
        {outcome && (
          <Notice tone={outcome.tone} title={outcome.tone === 'error' ? 'Not sent again' : undefined}>
            {outcome.text}
          </Notice>
        )}
      </div>
      {shown.length === 0 ? (
        <EmptyState title="No message in this state">Choose “Every message” to see them all.</EmptyState>
      ) : (
        <Table caption={`Outgoing mail (${shown.length} of ${outbox.data.length}), newest first`}>
          <THead>
            <Tr>
              <Th>Subject</Th>
              <Th>To</Th>
              <Th>State</Th>
              <Th numeric>Attempts</Th>
              <Th>Last error</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </Tr>
          </THead>
          <TBody>
            {shown.map((m) => (
              <Tr key={m.id}>
                <RowHeader className="max-w-80">
                  <Link to={messageHref(m.id)} className="break-words">
                    {m.subject}
                  </Link>
                  <span className="block text-fine font-normal text-muted">
                    {kindLabel(m.kind)} · queued {formatDateTime(m.createdAt)}
                    {m.attachments.length > 0 && ` · ${m.attachments.length} attached`}
                  </span>
                </RowHeader>
                <Td className="max-w-64 break-words">{m.to.join(', ')}</Td>
                <Td>
                  <Badge tone={STATUS_TONES[m.status]}>{statusLabel(m.status)}</Badge>
                  {m.status === 'sent' && m.sentAt && <span className="mt-1 block text-fine text-muted">{formatDateTime(m.sentAt)}</span>}
                  {m.status === 'retrying' && m.nextAttemptAt && <span className="mt-1 block text-fine text-muted">next try {formatDateTime(m.nextAttemptAt)}</span>}
                </Td>
                <Td numeric>{formatCount(m.attempts)}</Td>
                <Td className="max-w-64 break-words text-fine">{m.lastError ?? <span className="text-muted">—</span>}</Td>
                <Td className="text-right">
                  {canRetry(m) && (
                    <Button variant="secondary" size="sm" busy={retry.isPending && retry.variables === m.id} onClick={() => tryAgain(m)} aria-label={`Try again: ${m.subject}`}>
                      Try again
                    </Button>
                  )}
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}

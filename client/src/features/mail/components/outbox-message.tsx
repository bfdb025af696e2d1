import { useState } from 'react';
import { errorMessage } from '../../../lib/api-client';
import { formatCount, formatDateTime } from '../../../lib/format';
import { Badge, Button, ErrorState, LoadingState, Notice } from '../../../ui';
import { useOutboxMessage, useRetryMail } from '../api/use-outbox';
import { canRetry, kindLabel, STATUS_TONES, statusLabel } from './mail-words';

/** One-time links (invitations, password resets) belong to their addressee: not shown on screen. */
const hideLinks = (text: string) => text.replace(/(#token=)[A-Za-z0-9_-]+/g, '$1(hidden)');

/** One message as it was (or will be) sent: addressees, state, attachments and the text. */
export function OutboxMessage({ mailId }: { mailId: number }) {
  const message = useOutboxMessage(mailId);
  const retry = useRetryMail();
  const [retryError, setRetryError] = useState<string | null>(null);

  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) return <ErrorState title="This message could not be loaded" error={message.error} onRetry={() => void message.refetch()} />;
  const m = message.data;

  return (
    <div className="flex flex-col gap-5">
      <dl className="grid gap-x-6 gap-y-3 text-small sm:grid-cols-[max-content_minmax(0,1fr)]">
        <dt className="ledger-label pt-0.5">Kind</dt>
        <dd>{kindLabel(m.kind)}</dd>
        <dt className="ledger-label pt-0.5">To</dt>
        <dd className="break-words">{m.to.join(', ')}</dd>
        <dt className="ledger-label pt-0.5">State</dt>
        <dd className="flex flex-wrap items-center gap-x-3 gap-y-1">
          <Badge tone={STATUS_TONES[m.status]}>{statusLabel(m.status)}</Badge>
          <span className="text-muted">
            {formatCount(m.attempts)} {m.attempts === 1 ? 'attempt' : 'attempts'}
            {m.sentAt && ` · delivered ${formatDateTime(m.sentAt)}`}
            {m.status === 'retrying' && m.nextAttemptAt && ` · next try ${formatDateTime(m.nextAttemptAt)}`}
          </span>
        </dd>
        <dt className="ledger-label pt-0.5">Queued</dt>
        <dd>{formatDateTime(m.createdAt)}</dd>
        {m.lastError && (
          <>
            <dt className="ledger-label pt-0.5">Last error</dt>
            <dd className="break-words text-fault">{m.lastError}</dd>
          </>
        )}
        <dt className="ledger-label pt-0.5">Attached</dt>
        <dd>
          {m.attachments.length === 0 ? (
            <span className="text-muted">Nothing</span>
          ) : (
            <ul className="flex flex-col gap-0.5">
              {m.attachments.map((a) => (
                <li key={a.filename}>
                  {a.filename} <span className="text-muted">({a.contentType})</span>
                </li>
              ))}
            </ul>
          )}
        </dd>
      </dl>
      {canRetry(m) && (
        <div className="no-print flex flex-col gap-3">
          {retryError && (
            <Notice tone="error" title="Not sent again">
              {retryError}
            </Notice>
          )}
          <div>
            <Button
              variant="secondary"
              busy={retry.isPending}
              onClick={() => {
                setRetryError(null);
                retry.mutate(m.id, { onError: (error) => setRetryError(errorMessage(error)) });
              }}
            >
              Try again
            </Button>
          </div>
        </div>
      )}
      <section aria-labelledby="mail-text-heading" className="flex flex-col gap-2">
        <h2 id="mail-text-heading" className="ledger-label">
          Text of the message
        </h2>
        <pre className="max-h-[36rem] overflow-auto rounded-card border border-rule bg-paper px-4 py-3 font-sans text-small break-words whitespace-pre-wrap text-ink">
          {hideLinks(m.text ?? '')}
        </pre>
        <p className="text-fine text-muted">One-time password links are hidden here; only the addressee can use them.</p>
      </section>
    </div>
  );
}

import { Link, useParams } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { PageHeader, Panel } from '../ui';
import { OutboxList, OutboxMessage, useOutboxMessage } from '../features/mail';
import { positiveId } from './route-ids';
import { NotFoundPage } from './not-found-page';

/** Admins: every outgoing message and how far it got. */
export function AdminOutboxPage() {
  usePageTitle('Outgoing mail');
  return (
    <>
      <PageHeader
        eyebrow="Admin"
        title="Outgoing mail"
        description="Every message Gaugeline sends: invitations, password links, import notices and critical members. Messages are kept first and sent after, so nothing is lost while the mail service is down."
      />
      <Panel title="Messages" description="Newest first. Open a subject to read the message as it was sent.">
        <OutboxList messageHref={(id) => `${paths.adminOutbox}/${id}`} />
      </Panel>
    </>
  );
}

/** Admins: one outgoing message with its text. */
export function AdminOutboxMessagePage() {
  const mailId = positiveId(useParams().mailId);
  if (!mailId) return <NotFoundPage />;
  return <MessagePage mailId={mailId} key={mailId} />;
}

function MessagePage({ mailId }: { mailId: number }) {
  const message = useOutboxMessage(mailId);
  usePageTitle(message.data ? message.data.subject : 'Message');
  return (
    <>
      <p className="no-print mb-4 text-small">
        <Link to={paths.adminOutbox}>← Outgoing mail</Link>
      </p>
      <PageHeader eyebrow="Admin · outgoing mail" title={message.data?.subject ?? 'Message'} />
      <Panel title="The message">
        <OutboxMessage mailId={mailId} />
      </Panel>
    </>
  );
}

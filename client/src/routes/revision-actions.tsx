import { useState } from 'react';
import { Link } from 'react-router';
import { EDITING_ROLES, type Revision } from '@shared/api';
import { paths } from '../lib/paths';
import { Button, buttonClass, Modal } from '../ui';
import { SendCriticalForm } from '../features/mail';
import { useSignedInUser } from './guards';

/**
 * The revision page's header actions: what changed since the previous revision, and
 * (engineers and admins) sending the critical members by e-mail.
 */
export function RevisionActions({ projectId, revision }: { projectId: number; revision: Revision }) {
  const user = useSignedInUser();
  const canSend = EDITING_ROLES.includes(user.role);
  const [sending, setSending] = useState(false);
  if (revision.status !== 'done') return null;
  return (
    <>
      {revision.number > 1 && (
        <Link to={paths.revisionChanges(projectId, revision.id)} className={buttonClass('secondary', 'md', 'no-print')}>
          What changed since the previous revision
        </Link>
      )}
      {canSend && (
        <>
          <Button className="no-print" onClick={() => setSending(true)} aria-haspopup="dialog">
            Send critical members
          </Button>
          <Modal
            open={sending}
            onClose={() => setSending(false)}
            wide
            title={`Send the critical members of revision ${revision.number}`}
            description="An e-mail with the members at or above the utilisation you choose, listed by GlobalId in the files attached, with the cautions."
          >
            <SendCriticalForm projectId={projectId} revisionId={revision.id} revisionNumber={revision.number} currentUserEmail={user.email} onDone={() => setSending(false)} />
          </Modal>
        </>
      )}
    </>
  );
}

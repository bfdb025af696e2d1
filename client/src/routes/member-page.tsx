import { Link, useParams } from 'react-router';
import { EDITING_ROLES } from '@shared/api';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { MemberSheetView } from '../features/member-sheet';
import { useSignedInUser } from './guards';
import { positiveId } from './route-ids';
import { lastLedgerSearch } from './revision-selection';
import { NotFoundPage } from './not-found-page';

/** One member's sheet, addressed by its IFC GlobalId. */
export function MemberPage() {
  const params = useParams();
  const projectId = positiveId(params.projectId);
  const revisionId = positiveId(params.revisionId);
  const globalId = params.globalId ?? '';
  const user = useSignedInUser();
  usePageTitle(globalId ? `Member ${globalId}` : 'Member');
  if (!projectId || !revisionId || !/^[0-9A-Za-z_$]{22}$/.test(globalId)) return <NotFoundPage />;
  return (
    <MemberSheetView
      key={`${revisionId}/${globalId}`}
      projectId={projectId}
      revisionId={revisionId}
      globalId={globalId}
      canEdit={EDITING_ROLES.includes(user.role)}
      back={
        <p className="no-print mb-4 text-small">
          <Link to={paths.revision(projectId, revisionId, lastLedgerSearch(revisionId))}>← Member ledger</Link>
        </p>
      }
    />
  );
}

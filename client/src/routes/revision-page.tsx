import { useEffect } from 'react';
import { Link, useLocation, useParams } from 'react-router';
import { EDITING_ROLES, type StandardId } from '@shared/api';
import { formatDateTime } from '../lib/format';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { CautionsBlock, ErrorState, LoadingState, Notice, PageHeader, Panel } from '../ui';
import { standardName, useProject } from '../features/projects';
import { JobReport, useModels, useRevision } from '../features/models';
import { MemberLedger, RevisionOverviewPanel } from '../features/ledger';
import { ModelView } from '../features/model-view';
import { useSignedInUser } from './guards';
import { positiveId } from './route-ids';
import { rememberLedgerSearch, useRevisionSelection } from './revision-selection';
import { NotFoundPage } from './not-found-page';
import { RevisionActions } from './revision-actions';
import { useChangeOverlay, usePreviousRevision } from './change-overlay';

/**
 * A revision's results: the overview (bands, histogram, most critical), the member
 * ledger, the import's notes and the cautions. The selection of members belongs to
 * this page (useRevisionSelection) so any view of the revision can share it.
 */
export function RevisionPage() {
  const params = useParams();
  const projectId = positiveId(params.projectId);
  const revisionId = positiveId(params.revisionId);
  if (!projectId || !revisionId) return <NotFoundPage />;
  return <RevisionResults projectId={projectId} revisionId={revisionId} key={`${projectId}/${revisionId}`} />;
}

function RevisionResults({ projectId, revisionId }: { projectId: number; revisionId: number }) {
  const user = useSignedInUser();
  const canEdit = EDITING_ROLES.includes(user.role);
  const project = useProject(projectId);
  const models = useModels(projectId);
  const revision = useRevision(projectId, revisionId);
  const [selection, setSelection] = useRevisionSelection(revisionId);
  const { search } = useLocation();
  useEffect(() => rememberLedgerSearch(revisionId, search), [revisionId, search]);
  const r = revision.data;
  const model = r ? models.data?.find((m) => m.id === r.modelId) : undefined;
  const title = r ? `${model?.name ?? 'Model'}, revision ${r.number}` : 'Revision';
  usePageTitle(r ? `${title} results` : 'Revision');
  const memberHref = (globalId: string) => paths.member(projectId, revisionId, globalId);
  const changeOverlay = useChangeOverlay(projectId, revisionId, usePreviousRevision(projectId, r), false);

  return (
    <>
      <p className="no-print mb-4 text-small">
        <Link to={paths.project(projectId)}>← {project.data?.name ?? 'Project'}</Link>
      </p>
      <PageHeader
        eyebrow={project.data ? `${project.data.name} · results` : 'Results'}
        title={title}
        description={
          r && (
            <>
              {r.fileName} · checked to {standardName(r.standard as StandardId)} · uploaded {formatDateTime(r.createdAt)}
              {r.uploadedBy ? ` by ${r.uploadedBy}` : ''}
            </>
          )
        }
        actions={r && <RevisionActions projectId={projectId} revision={r} />}
      />
      {revision.isPending && <LoadingState label="Loading the revision…" />}
      {revision.isError && <ErrorState title="This revision could not be opened" error={revision.error} onRetry={() => void revision.refetch()} />}
      {r && r.status !== 'done' && (
        <div className="flex flex-col gap-block">
          <Panel title="Import">
            <JobReport projectId={projectId} revision={r} />
          </Panel>
          <CautionsBlock />
        </div>
      )}
      {r && r.status === 'done' && (
        <div className="flex flex-col gap-block">
          <Panel
            title="Model"
            description={`Steel coloured by ${changeOverlay?.active ? changeOverlay.label : 'result band'}. Click a member for its figures; the selection is shared with the ledger.`}
          >
            <ModelView projectId={projectId} revisionId={revisionId} selection={selection} onSelectionChange={setSelection} overlay={changeOverlay} />
          </Panel>
          <Panel title="Overview" description="Tension members by result band and by utilisation.">
            <RevisionOverviewPanel projectId={projectId} revisionId={revisionId} memberHref={memberHref} />
          </Panel>
          <Panel
            title="Member ledger"
            description="One row per member, keyed by its IFC GlobalId. Open a GlobalId for the member's sheet: drawing, working, assumed values."
          >
            <MemberLedger
              projectId={projectId}
              revisionId={revisionId}
              selection={selection}
              onSelectionChange={setSelection}
              memberHref={memberHref}
              canExport={canEdit}
            />
          </Panel>
          <Panel title="Assumed values and import notes" level={2}>
            <div className="flex flex-col gap-3 text-small">
              <p>
                Where the model gives no value, Gaugeline assumes one (hole allowance, shear-lag factor, capacity factors, steel grade)
                and lists it on each member&rsquo;s sheet with its source. Review them before relying on a result.
              </p>
              {r.summary && r.summary.warnings.length > 0 ? (
                <Notice tone="caution" title="Notes from reading the model">
                  <ul className="list-disc pl-5">
                    {r.summary.warnings.map((w) => (
                      <li key={w.code}>
                        {w.message} <span className="text-muted">({w.count}×{w.examples.length ? `, e.g. ${w.examples.slice(0, 3).join(', ')}` : ''})</span>
                      </li>
                    ))}
                  </ul>
                </Notice>
              ) : (
                <p className="text-muted">Reading the model raised no notes.</p>
              )}
            </div>
          </Panel>
          <CautionsBlock />
        </div>
      )}
    </>
  );
}

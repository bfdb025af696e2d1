import { Link, useParams, useSearchParams } from 'react-router';
import type { Revision } from '@shared/api';
import { formatDateTime } from '../lib/format';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { CautionsBlock, EmptyState, ErrorState, LoadingState, PageHeader, Panel, Select } from '../ui';
import { useProject } from '../features/projects';
import { useModels, useRevision, useRevisions } from '../features/models';
import { ChangesView } from '../features/changes';
import { ModelView } from '../features/model-view';
import { useChangeOverlay } from './change-overlay';
import { useRevisionSelection } from './revision-selection';
import { positiveId } from './route-ids';
import { NotFoundPage } from './not-found-page';

/** What changed in a revision since an earlier one of the same model (?with=<revision id>). */
export function RevisionChangesPage() {
  const params = useParams();
  const projectId = positiveId(params.projectId);
  const revisionId = positiveId(params.revisionId);
  if (!projectId || !revisionId) return <NotFoundPage />;
  return <Changes projectId={projectId} revisionId={revisionId} key={`${projectId}/${revisionId}`} />;
}

function Changes({ projectId, revisionId }: { projectId: number; revisionId: number }) {
  const project = useProject(projectId);
  const revision = useRevision(projectId, revisionId);
  const models = useModels(projectId);
  const r = revision.data;
  const revisions = useRevisions(projectId, r?.modelId ?? 0, r !== undefined);
  const model = r ? models.data?.find((m) => m.id === r.modelId) : undefined;
  const [search, setSearch] = useSearchParams();

  // Earlier checked revisions of the same model, newest first; the default is the one just before.
  const earlier: Revision[] = r ? (revisions.data ?? []).filter((x) => x.number < r.number && x.status === 'done').sort((a, b) => b.number - a.number) : [];
  const asked = positiveId(search.get('with') ?? undefined);
  const chosen = earlier.find((x) => x.id === asked) ?? earlier[0] ?? null;

  const changeOverlay = useChangeOverlay(projectId, revisionId, chosen, true);
  const [selection, setSelection] = useRevisionSelection(revisionId);

  const title = r ? `What changed in revision ${r.number}` : 'What changed';
  usePageTitle(r ? `${model?.name ?? 'Model'}: ${title.toLowerCase()}` : title);

  return (
    <>
      <p className="no-print mb-4 text-small">
        <Link to={paths.revision(projectId, revisionId)}>← Results of {r ? `revision ${r.number}` : 'this revision'}</Link>
      </p>
      <PageHeader
        eyebrow={project.data ? `${project.data.name} · ${model?.name ?? 'model'}` : 'Changes'}
        title={title}
        description="Members are matched by IFC GlobalId (and, where GlobalIds were regenerated, by a tag used once on each side). Only members that changed are listed."
      />
      {revision.isPending && <LoadingState label="Loading the revision…" />}
      {revision.isError && <ErrorState title="This revision could not be opened" error={revision.error} onRetry={() => void revision.refetch()} />}
      {r && (
        <div className="flex flex-col gap-block">
          {r.status !== 'done' ? (
            <EmptyState title="This revision is not checked yet">Come back when its import has finished; only checked revisions can be compared.</EmptyState>
          ) : revisions.isPending ? (
            <LoadingState label="Loading the model's revisions…" />
          ) : revisions.isError ? (
            <ErrorState title="The model's revisions could not be loaded" error={revisions.error} onRetry={() => void revisions.refetch()} />
          ) : !chosen ? (
            <EmptyState title="Nothing earlier to compare with">
              Revision {r.number} is the first checked revision of this model. Upload the next export of the model under the same name to see what changed.
            </EmptyState>
          ) : (
            <Panel
              title={`Revision ${chosen.number} → revision ${r.number}`}
              actions={
                <Select
                  label="Compare with"
                  compact
                  className="no-print w-72 max-w-full"
                  value={String(chosen.id)}
                  onChange={(e) => setSearch({ with: e.target.value }, { replace: true })}
                  options={earlier.map((x) => ({ value: String(x.id), label: `Revision ${x.number} · ${formatDateTime(x.createdAt)}` }))}
                />
              }
            >
              <ChangesView projectId={projectId} revisionId={revisionId} withRevisionId={chosen.id} memberHref={(rid, globalId) => paths.member(projectId, rid, globalId)} />
            </Panel>
          )}
          {r?.status === 'done' && chosen && (
            <Panel
              title={`Revision ${r.number} in 3D`}
              description={`Members coloured by their change since revision ${chosen.number}; unchanged ones faint. Members taken out are listed beside the view.`}
            >
              <ModelView projectId={projectId} revisionId={revisionId} selection={selection} onSelectionChange={setSelection} overlay={changeOverlay} height={480} />
            </Panel>
          )}
          <CautionsBlock />
        </div>
      )}
    </>
  );
}

import { Link, useParams } from 'react-router';
import { EDITING_ROLES } from '@shared/api';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { Panel } from '../ui';
import { ProjectOverview } from '../features/projects';
import { ModelsList, UploadForm, useModels } from '../features/models';
import { ProjectLog } from '../features/project-log';
import { useSignedInUser } from './guards';
import { positiveId } from './route-ids';
import { NotFoundPage } from './not-found-page';

/** A project: its settings, its models with their revisions and import jobs, and (for engineers) uploads and the project log. */
export function ProjectPage() {
  usePageTitle('Project');
  const id = positiveId(useParams().projectId);
  if (!id) return <NotFoundPage />;
  return (
    <>
      <p className="no-print mb-4 text-small">
        <Link to={paths.home}>← All projects</Link>
      </p>
      <ProjectOverview projectId={id} key={id}>
        <ProjectModels projectId={id} />
        <ProjectLogSection projectId={id} />
      </ProjectOverview>
    </>
  );
}

function ProjectModels({ projectId }: { projectId: number }) {
  const user = useSignedInUser();
  const canEdit = EDITING_ROLES.includes(user.role);
  const models = useModels(projectId);
  return (
    <div data-layout="split" className={canEdit ? 'grid gap-block lg:grid-cols-[minmax(0,1fr)_24rem] lg:items-start' : undefined}>
      <Panel title="Models" description="IFC building models of this project, newest revision first. Open a checked revision to see its results.">
        <ModelsList
          projectId={projectId}
          canEdit={canEdit}
          emptyHint={
            canEdit
              ? 'No IFC model has been uploaded to this project. Upload one with the form alongside; Gaugeline then lists the steel tension members it finds and checks their bolted ends.'
              : 'No IFC model has been uploaded to this project yet. An engineer on the project can upload one.'
          }
        />
      </Panel>
      {canEdit && (
        <Panel title="Upload a model" className="no-print" description="An IFC file (.ifc or .ifczip). Each upload becomes a new revision, checked straight away.">
          <UploadForm projectId={projectId} models={models.data ?? []} />
        </Panel>
      )}
    </div>
  );
}

/** Who did what in the project; the server refuses it to viewers, so they are not offered it. */
function ProjectLogSection({ projectId }: { projectId: number }) {
  const user = useSignedInUser();
  if (!EDITING_ROLES.includes(user.role)) return null;
  return (
    <Panel title="Project log" description="Uploads, member changes, forces tables, exports and mails sent in this project: who, when and why, newest first.">
      <ProjectLog projectId={projectId} />
    </Panel>
  );
}

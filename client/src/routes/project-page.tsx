import { Link, useParams } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { ProjectOverview } from '../features/projects';
import { NotFoundPage } from './not-found-page';

export function ProjectPage() {
  usePageTitle('Project');
  const { projectId } = useParams();
  const id = Number(projectId);
  if (!/^\d+$/.test(projectId ?? '') || !Number.isSafeInteger(id) || id <= 0) return <NotFoundPage />;
  return (
    <>
      <p className="no-print mb-4 text-small">
        <Link to={paths.home}>← All projects</Link>
      </p>
      <ProjectOverview projectId={id} key={id} />
    </>
  );
}

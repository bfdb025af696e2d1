import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { formatDate } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { EmptyState, ErrorState, LoadingState, Table, TBody, THead, Td, Th, Tr, RowHeader } from '../../../ui';
import { useProjects } from '../api/use-projects';
import { standardName } from './standard-name';

/** The projects the signed-in person can see, as a ruled table. */
export function ProjectList({ emptyHint }: { emptyHint: ReactNode }) {
  const projects = useProjects();

  if (projects.isPending) return <LoadingState label="Loading projects…" />;
  if (projects.isError) return <ErrorState title="Projects could not be loaded" error={projects.error} onRetry={() => void projects.refetch()} />;
  if (projects.data.length === 0) return <EmptyState title="No projects yet">{emptyHint}</EmptyState>;

  const sorted = [...projects.data].sort((a, b) => b.updatedAt.localeCompare(a.updatedAt));
  return (
    <Table caption="Projects" framed>
      <THead>
        <Tr>
          <Th>Project</Th>
          <Th>Standard</Th>
          <Th className="hidden sm:table-cell">Default grade</Th>
          <Th numeric>Last changed</Th>
        </Tr>
      </THead>
      <TBody>
        {sorted.map((project) => (
          <Tr key={project.id}>
            <RowHeader>
              <Link to={paths.project(project.id)}>{project.name}</Link>
              {project.description && <p className="mt-0.5 line-clamp-2 max-w-prose font-normal text-muted print:line-clamp-none">{project.description}</p>}
            </RowHeader>
            <Td>{standardName(project.standard)}</Td>
            <Td className="hidden sm:table-cell">{project.defaultGrade || '—'}</Td>
            <Td numeric>
              <time dateTime={project.updatedAt}>{formatDate(project.updatedAt)}</time>
            </Td>
          </Tr>
        ))}
      </TBody>
    </Table>
  );
}

import { useState } from 'react';
import type { ProjectMember } from '@shared/api';
import { errorMessage } from '../../../lib/api-client';
import { formatDate } from '../../../lib/format';
import { ROLE_LABELS } from '../../../lib/roles';
import { Badge, Button, ConfirmDialog, EmptyState, ErrorState, LoadingState, Notice, RowHeader, Select, Table, TBody, THead, Td, Th, Tr } from '../../../ui';
import { useAddProjectMember } from '../api/use-add-project-member';
import { useProjectMembers } from '../api/use-project-members';
import { useRemoveProjectMember } from '../api/use-remove-project-member';
import { useUsers } from '../api/use-users';

export interface ProjectChoice {
  id: number;
  name: string;
}

type Outcome = { tone: 'success' | 'error'; text: string } | null;

interface ProjectAccessProps {
  /** The projects to choose from (the route supplies them). */
  projects: readonly ProjectChoice[];
  selectedProjectId: number | null;
  onSelectProject: (projectId: number | null) => void;
}

/** Pick a project, see who has access, give or take away access. */
export function ProjectAccess({ projects, selectedProjectId, onSelectProject }: ProjectAccessProps) {
  const selected = projects.find((p) => p.id === selectedProjectId) ?? null;
  const options = [{ value: '', label: 'Choose a project' }, ...projects.map((p) => ({ value: String(p.id), label: p.name }))];
  return (
    <div className="flex flex-col gap-5">
      <Select
        label="Project"
        options={options}
        value={selected ? String(selected.id) : ''}
        onChange={(e) => onSelectProject(e.target.value ? Number(e.target.value) : null)}
        className="max-w-md"
      />
      {selected ? <MembersOf project={selected} key={selected.id} /> : <p className="text-small text-muted">Choose a project to see who has access to it.</p>}
    </div>
  );
}

function MembersOf({ project }: { project: ProjectChoice }) {
  const members = useProjectMembers(project.id);
  const users = useUsers();
  const add = useAddProjectMember();
  const remove = useRemoveProjectMember();
  const [candidate, setCandidate] = useState('');
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [removing, setRemoving] = useState<ProjectMember | null>(null);

  if (members.isPending) return <LoadingState label="Loading who has access…" />;
  if (members.isError) return <ErrorState title="Access list could not be loaded" error={members.error} onRetry={() => void members.refetch()} />;

  const memberIds = new Set(members.data.map((m) => m.userId));
  const addable = (users.data ?? []).filter((u) => u.active && !memberIds.has(u.id)).sort((a, b) => a.name.localeCompare(b.name));
  const candidateOptions = [
    { value: '', label: addable.length ? 'Choose a person' : 'Everyone active already has access' },
    ...addable.map((u) => ({ value: String(u.id), label: `${u.name} (${ROLE_LABELS[u.role]}, ${u.email})` })),
  ];

  const giveAccess = () => {
    const user = addable.find((u) => String(u.id) === candidate);
    if (!user) {
      setOutcome({ tone: 'error', text: 'Choose a person first.' });
      return;
    }
    setOutcome(null);
    add.mutate(
      { projectId: project.id, userId: user.id },
      {
        onSuccess: () => {
          setCandidate('');
          setOutcome({ tone: 'success', text: `${user.name} now has access to ${project.name}.` });
        },
        onError: (error) => setOutcome({ tone: 'error', text: errorMessage(error) }),
      },
    );
  };

  const takeAway = (member: ProjectMember) => {
    setOutcome(null);
    remove.mutate(
      { projectId: project.id, userId: member.userId },
      {
        onSuccess: () => setOutcome({ tone: 'success', text: `${member.name} no longer has access to ${project.name}.` }),
        onError: (error) => setOutcome({ tone: 'error', text: `${member.name}: ${errorMessage(error)}` }),
        onSettled: () => setRemoving(null),
      },
    );
  };

  return (
    <div className="flex flex-col gap-4">
      <form
        aria-label={`Add someone to ${project.name}`}
        className="flex flex-wrap items-end gap-3"
        onSubmit={(event) => {
          event.preventDefault();
          giveAccess();
        }}
      >
        <Select
          label="Give access to"
          options={candidateOptions}
          value={candidate}
          onChange={(e) => setCandidate(e.target.value)}
          disabled={users.isPending || addable.length === 0}
          description={users.isError ? `People could not be loaded: ${errorMessage(users.error)}` : undefined}
          className="min-w-72 flex-1"
        />
        <Button type="submit" busy={add.isPending} disabled={!candidate}>
          Give access
        </Button>
      </form>

      <div aria-live="polite">{outcome && <Notice tone={outcome.tone}>{outcome.text}</Notice>}</div>

      {members.data.length === 0 ? (
        <EmptyState title="Nobody has been given access yet">Choose a person above to give them access to this project.</EmptyState>
      ) : (
        <Table caption={`People with access to ${project.name}`}>
          <THead>
            <Tr>
              <Th>Person</Th>
              <Th>Role</Th>
              <Th numeric>Since</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </Tr>
          </THead>
          <TBody>
            {members.data.map((member) => (
              <Tr key={member.userId}>
                <RowHeader>
                  {member.name}
                  <span className="block font-normal break-words text-muted">{member.email}</span>
                </RowHeader>
                <Td>
                  <Badge tone={member.role === 'admin' ? 'copper' : 'neutral'}>{ROLE_LABELS[member.role]}</Badge>
                </Td>
                <Td numeric>{formatDate(member.addedAt)}</Td>
                <Td className="text-right">
                  <Button variant="danger" size="sm" onClick={() => setRemoving(member)} aria-label={`Remove ${member.name} from ${project.name}`}>
                    Remove
                  </Button>
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}

      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove ${removing.name} from ${project.name}?` : 'Remove?'}
        confirmLabel="Remove access"
        confirmVariant="danger"
        busy={remove.isPending}
        onCancel={() => setRemoving(null)}
        onConfirm={() => removing && takeAway(removing)}
      >
        They will no longer see this project or its results. Their account stays, and you can give access again later.
      </ConfirmDialog>
    </div>
  );
}

import { useId, useState } from 'react';
import { ROLES, type Role, type User } from '@shared/api';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { ROLE_LABELS } from '../../../lib/roles';
import { Badge, Button, ConfirmDialog, EmptyState, ErrorState, LoadingState, Notice, RowHeader, Select, Table, TBody, TextField, THead, Td, Th, Tr } from '../../../ui';
import { useUpdateUser } from '../api/use-update-user';
import { useResendInvitation } from '../api/use-resend-invitation';
import { useUsers } from '../api/use-users';

type Outcome = { tone: 'success' | 'error'; text: string } | null;

const roleOptions = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

/** Everyone with an account; admins change roles and deactivate or reactivate people here. */
export function PeopleTable({ currentUserId }: { currentUserId: number }) {
  const users = useUsers();
  const update = useUpdateUser();
  const invite = useResendInvitation();
  const [filter, setFilter] = useState('');
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [confirming, setConfirming] = useState<User | null>(null);

  const apply = (user: User, changes: { role?: Role; active?: boolean }, success: string) => {
    setOutcome(null);
    update.mutate(
      { userId: user.id, changes },
      {
        onSuccess: () => setOutcome({ tone: 'success', text: success }),
        onError: (error) => setOutcome({ tone: 'error', text: `${user.name}: ${errorMessage(error)}` }),
        onSettled: () => setConfirming(null),
      },
    );
  };

  const inviteAgain = (user: User) => {
    setOutcome(null);
    invite.mutate(user.id, {
      onSuccess: (message) => setOutcome({ tone: 'success', text: message }),
      onError: (error) => setOutcome({ tone: 'error', text: `${user.name}: ${errorMessage(error)}` }),
    });
  };

  if (users.isPending) return <LoadingState label="Loading people…" />;
  if (users.isError) return <ErrorState title="People could not be loaded" error={users.error} onRetry={() => void users.refetch()} />;

  const needle = filter.trim().toLowerCase();
  const shown = users.data
    .filter((u) => !needle || u.name.toLowerCase().includes(needle) || u.email.toLowerCase().includes(needle))
    .sort((a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name));

  return (
    <div className="flex flex-col gap-4">
      <TextField label="Find a person" type="search" description="By name or e-mail address." value={filter} onChange={(e) => setFilter(e.target.value)} className="max-w-sm" />
      <div aria-live="polite">
        {outcome && (
          <Notice tone={outcome.tone} title={outcome.tone === 'error' ? 'Not done' : undefined}>
            {outcome.text}
          </Notice>
        )}
      </div>
      {shown.length === 0 ? (
        <EmptyState title={needle ? 'Nobody matches' : 'Nobody here yet'}>{needle ? 'Try part of a name or e-mail address.' : 'Add the first person above.'}</EmptyState>
      ) : (
        <Table caption={`People (${shown.length} of ${users.data.length})`}>
          <THead>
            <Tr>
              <Th>Person</Th>
              <Th>Role</Th>
              <Th>Status</Th>
              <Th numeric>Last signed in</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </Tr>
          </THead>
          <TBody>
            {shown.map((user) => {
              const self = user.id === currentUserId;
              return (
                <Tr key={user.id} className={user.active ? undefined : 'text-muted'}>
                  <RowHeader>
                    <span className={user.active ? undefined : 'text-muted'}>{user.name}</span>
                    {self && <span className="font-normal text-muted"> (you)</span>}
                    <span className="block font-normal break-words text-muted">{user.email}</span>
                  </RowHeader>
                  <Td>
                    {self ? (
                      <Badge tone={user.role === 'admin' ? 'copper' : 'neutral'}>{ROLE_LABELS[user.role]}</Badge>
                    ) : (
                      <RoleChanger user={user} busy={update.isPending && update.variables?.userId === user.id} onChange={(role) => apply(user, { role }, `${user.name} is now ${ROLE_LABELS[role]}.`)} />
                    )}
                  </Td>
                  <Td>{user.active ? <Badge tone="sound">Active</Badge> : <Badge tone="muted">Deactivated</Badge>}</Td>
                  <Td numeric>{formatDateTime(user.lastSignInAt, 'Never')}</Td>
                  <Td className="text-right">
                    {self ? null : user.active ? (
                      <div className="flex flex-wrap justify-end gap-2">
                        {user.lastSignInAt === null && (
                          <Button
                            variant="secondary"
                            size="sm"
                            busy={invite.isPending && invite.variables === user.id}
                            onClick={() => inviteAgain(user)}
                            aria-label={`Send ${user.name} the invitation again`}
                            title="A new link to choose a password; earlier links stop working"
                          >
                            Send invitation again
                          </Button>
                        )}
                        <Button variant="danger" size="sm" onClick={() => setConfirming(user)} aria-label={`Deactivate ${user.name}`}>
                          Deactivate
                        </Button>
                      </div>
                    ) : (
                      <Button
                        variant="secondary"
                        size="sm"
                        busy={update.isPending && update.variables?.userId === user.id}
                        onClick={() => apply(user, { active: true }, `${user.name} can sign in again.`)}
                        aria-label={`Reactivate ${user.name}`}
                      >
                        Reactivate
                      </Button>
                    )}
                  </Td>
                </Tr>
              );
            })}
          </TBody>
        </Table>
      )}
      <ConfirmDialog
        open={confirming !== null}
        title={confirming ? `Deactivate ${confirming.name}?` : 'Deactivate?'}
        confirmLabel="Deactivate"
        confirmVariant="danger"
        busy={update.isPending}
        onCancel={() => setConfirming(null)}
        onConfirm={() => confirming && apply(confirming, { active: false }, `${confirming.name} is deactivated and can no longer sign in.`)}
      >
        They will no longer be able to sign in. Their projects and past work stay as they are, and you can reactivate them at any time.
      </ConfirmDialog>
    </div>
  );
}

/** A role select with its own button, so nothing changes until the admin confirms. */
function RoleChanger({ user, busy, onChange }: { user: User; busy: boolean; onChange: (role: Role) => void }) {
  const [role, setRole] = useState<Role>(user.role);
  const id = useId();
  const changed = role !== user.role;
  return (
    <form
      className="flex items-center gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        if (changed) onChange(role);
      }}
    >
      <Select id={id} label={`Role of ${user.name}`} hideLabel compact options={roleOptions} value={role} onChange={(e) => setRole(e.target.value as Role)} className="w-32" />
      {changed && (
        <Button type="submit" size="sm" variant="secondary" busy={busy}>
          Change role
        </Button>
      )}
    </form>
  );
}

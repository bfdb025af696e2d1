import { useState } from 'react';
import { PASSWORD_MIN_LENGTH, ROLES, createUserRequestSchema, type Role, type User } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '../../../lib/roles';
import { Button, Notice, Select, TextField } from '../../../ui';
import { useCreateUser } from '../api/use-create-user';

const initial = { email: '', name: '', role: 'engineer', password: '' };
const roleOptions = ROLES.map((role) => ({ value: role, label: ROLE_LABELS[role] }));

/** Adds a person: e-mail, name, role, and either a starting password or an e-mailed invitation. */
export function CreatePersonForm({ onCreated }: { onCreated?: (user: User) => void }) {
  const create = useCreateUser();
  const [added, setAdded] = useState<{ user: User; invited: boolean } | null>(null);
  const form = useZodForm({
    initial,
    schema: createUserRequestSchema,
    prepare: (v) => ({ ...v, password: v.password === '' ? undefined : v.password }),
  });

  const submit = form.formProps(async (request) => {
    setAdded(null);
    const user = await create.mutateAsync(request);
    form.reset();
    setAdded({ user, invited: !request.password });
    onCreated?.(user);
  });

  return (
    <form {...submit} aria-label="Add a person" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Person not added">
          {form.formError}
        </Notice>
      )}
      {added && (
        <Notice tone="success" title={`${added.user.name} added as ${ROLE_LABELS[added.user.role]}`}>
          {added.invited && <>An invitation is on its way to {added.user.email}, with a link to choose a password. </>}
          Give them access to their projects under Project access.
        </Notice>
      )}
      <div className="@container">
        <div className="grid items-start gap-5 @xl:grid-cols-2">
          <TextField label="E-mail address" type="email" autoComplete="off" spellCheck={false} autoCapitalize="none" {...form.field('email')} />
          <TextField label="Name" autoComplete="off" {...form.field('name')} />
          <Select label="Role" options={roleOptions} description={ROLE_DESCRIPTIONS[form.values.role as Role] ?? undefined} {...form.field('role')} />
          <TextField
            label="Starting password"
            type="password"
            optional
            autoComplete="new-password"
            description={`Leave empty to e-mail them an invitation with a link to choose their own password. If you set one (at least ${PASSWORD_MIN_LENGTH} characters), pass it on privately and ask them to change it under Account.`}
            {...form.field('password')}
          />
        </div>
      </div>
      <div>
        <Button type="submit" busy={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add person'}
        </Button>
      </div>
    </form>
  );
}

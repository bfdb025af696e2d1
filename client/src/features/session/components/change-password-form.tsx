import { useState } from 'react';
import { PASSWORD_MIN_LENGTH, changePasswordRequestSchema } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { Button, Notice, TextField } from '../../../ui';
import { useChangePassword } from '../api/use-change-password';

const initial = { currentPassword: '', newPassword: '', confirmPassword: '' };
type Field = keyof typeof initial;

/** Current password, new password twice. */
export function ChangePasswordForm() {
  const change = useChangePassword();
  const [done, setDone] = useState(false);
  const form = useZodForm({
    initial,
    schema: changePasswordRequestSchema,
    prepare: (v) => ({ currentPassword: v.currentPassword, newPassword: v.newPassword }),
    check: (v) => {
      const errors: Partial<Record<Field, string>> = {};
      if (v.confirmPassword !== v.newPassword) errors.confirmPassword = 'Type the same new password again';
      if (v.newPassword && v.newPassword === v.currentPassword) errors.newPassword = 'Choose a password different from the current one';
      return errors;
    },
  });

  const submit = form.formProps(async (request) => {
    setDone(false);
    await change.mutateAsync(request);
    form.reset();
    setDone(true);
  });

  return (
    <form {...submit} aria-label="Change password" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Password not changed">
          {form.formError}
        </Notice>
      )}
      {done && <Notice tone="success" title="Password changed">Use the new password next time you sign in.</Notice>}
      <TextField label="Current password" type="password" autoComplete="current-password" {...form.field('currentPassword')} />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        description={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a strong one.`}
        {...form.field('newPassword')}
      />
      <TextField label="New password again" type="password" autoComplete="new-password" {...form.field('confirmPassword')} />
      <div>
        <Button type="submit" busy={change.isPending}>
          {change.isPending ? 'Changing…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}

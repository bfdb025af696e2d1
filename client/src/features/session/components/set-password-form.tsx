import { useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { z } from 'zod';
import { PASSWORD_MIN_LENGTH, newPasswordSchema } from '@shared/api';
import { isApiError } from '../../../lib/api-client';
import { useZodForm } from '../../../lib/form';
import { Button, Notice, TextField } from '../../../ui';
import { useSetPasswordFromLink } from '../api/use-password-links';

const initial = { newPassword: '', confirmPassword: '' };
type Field = keyof typeof initial;
const schema = z.object({ newPassword: newPasswordSchema });
/** The server's id for a link that was used, has expired or never existed. */
const TOKEN_INVALID = 'token.invalid';

interface SetPasswordFormProps {
  /** The one-time token from the e-mailed link. */
  token: string;
  /** Shown once the password is set (e.g. a link to sign in). */
  done: ReactNode;
  /** Shown under the server's message when the link no longer works (e.g. a link to ask for a new one). */
  expired: ReactNode;
}

/** New password twice, sent with the token of an invitation or reset link. */
export function SetPasswordForm({ token, done, expired }: SetPasswordFormProps) {
  const set = useSetPasswordFromLink();
  const [finished, setFinished] = useState(false);
  const [deadLink, setDeadLink] = useState<string | null>(null);
  const check = useMemo(
    () => (v: Record<Field, string>) => {
      const errors: Partial<Record<Field, string>> = {};
      if (v.confirmPassword !== v.newPassword) errors.confirmPassword = 'Type the same password again';
      return errors;
    },
    [],
  );
  const form = useZodForm({ initial, schema, prepare: (v) => ({ newPassword: v.newPassword }), check });
  // The form gives way to the outcome: move focus there so it is announced and keyboard users stay in place.
  const outcomeRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (finished || deadLink) outcomeRef.current?.focus();
  }, [finished, deadLink]);

  const submit = form.formProps(async ({ newPassword }) => {
    try {
      await set.mutateAsync({ token, newPassword });
      setFinished(true);
    } catch (error) {
      if (isApiError(error, TOKEN_INVALID)) {
        setDeadLink(error.message);
        return;
      }
      throw error;
    }
  });

  if (finished) {
    return (
      <Notice tone="success" ref={outcomeRef}>
        {done}
      </Notice>
    );
  }
  if (deadLink) {
    return (
      <Notice tone="error" ref={outcomeRef} title="This link no longer works">
        <p>{deadLink}</p>
        <div className="mt-2">{expired}</div>
      </Notice>
    );
  }

  return (
    <form {...submit} aria-label="Choose a password" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Password not set">
          {form.formError}
        </Notice>
      )}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        description={`At least ${PASSWORD_MIN_LENGTH} characters. A few unrelated words make a strong one.`}
        {...form.field('newPassword')}
      />
      <TextField label="New password again" type="password" autoComplete="new-password" {...form.field('confirmPassword')} />
      <div>
        <Button type="submit" busy={set.isPending}>
          {set.isPending ? 'Setting…' : 'Set password'}
        </Button>
      </div>
    </form>
  );
}

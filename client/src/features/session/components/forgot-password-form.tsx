import { useState } from 'react';
import { passwordResetRequestSchema } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { Button, Notice, TextField } from '../../../ui';
import { useRequestPasswordLink } from '../api/use-password-links';

/**
 * Asks for a one-time link to choose a new password. The answer is the server's own
 * neutral sentence: it never says whether the address has an account.
 */
export function ForgotPasswordForm() {
  const request = useRequestPasswordLink();
  const [answer, setAnswer] = useState<string | null>(null);
  const form = useZodForm({ initial: { email: '' }, schema: passwordResetRequestSchema });

  const submit = form.formProps(async (body) => {
    setAnswer(null);
    setAnswer(await request.mutateAsync(body));
  });

  return (
    <form {...submit} aria-label="Ask for a password link" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="No link sent">
          {form.formError}
        </Notice>
      )}
      {answer && (
        <Notice tone="success" title="Request received">
          {answer} Check your inbox (and the junk folder); the link works once and for a short time.
        </Notice>
      )}
      <TextField
        label="E-mail address"
        type="email"
        autoComplete="username"
        inputMode="email"
        spellCheck={false}
        autoCapitalize="none"
        description="The address you sign in with."
        {...form.field('email')}
      />
      <div>
        <Button type="submit" busy={request.isPending}>
          {request.isPending ? 'Sending…' : answer ? 'Send another link' : 'Send me a link'}
        </Button>
      </div>
    </form>
  );
}

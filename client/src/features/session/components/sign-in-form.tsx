import { signInRequestSchema, type SessionUser } from '@shared/api';
import { useZodForm } from '../../../lib/form';
import { Button, Notice, TextField } from '../../../ui';
import { useSignIn } from '../api/use-sign-in';

/** E-mail and password. Calls onSignedIn once the server has accepted them. */
export function SignInForm({ onSignedIn }: { onSignedIn: (user: SessionUser) => void }) {
  const signIn = useSignIn();
  const form = useZodForm({ initial: { email: '', password: '' }, schema: signInRequestSchema });

  const submit = form.formProps(async (request) => {
    const session = await signIn.mutateAsync(request);
    if (session.user) onSignedIn(session.user);
  });

  return (
    <form {...submit} aria-label="Sign in" className="flex flex-col gap-5">
      {form.formError && (
        <Notice tone="error" ref={form.noticeRef} title="Not signed in">
          {form.formError}
        </Notice>
      )}
      <TextField label="E-mail address" type="email" autoComplete="username" inputMode="email" spellCheck={false} autoCapitalize="none" {...form.field('email')} />
      <TextField label="Password" type="password" autoComplete="current-password" {...form.field('password')} />
      <div>
        <Button type="submit" busy={signIn.isPending}>
          {signIn.isPending ? 'Signing in…' : 'Sign in'}
        </Button>
      </div>
    </form>
  );
}

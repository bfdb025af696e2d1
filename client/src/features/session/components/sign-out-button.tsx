import { useState } from 'react';
import { errorMessage } from '../../../lib/api-client';
import { Button } from '../../../ui';
import { useSignOut } from '../api/use-sign-out';

/** Ends the session. The route guard then shows the sign-in page. */
export function SignOutButton() {
  const signOut = useSignOut();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        variant="secondary"
        size="sm"
        busy={signOut.isPending}
        onClick={() => {
          setProblem(null);
          signOut.mutate(undefined, { onError: (e) => setProblem(errorMessage(e)) });
        }}
      >
        Sign out
      </Button>
      {problem && (
        <span role="alert" className="text-small font-semibold text-fault">
          {problem}
        </span>
      )}
    </span>
  );
}

import type { SessionUser } from '@shared/api';
import { useSession } from '../api/use-session';
import { wasSignedOutDeliberately } from './sign-out-intent';

/**
 * The signed-in person, for guards and role-dependent views.
 * `user` is undefined while the session is loading, null when signed out.
 */
export function useCurrentUser(): {
  user: SessionUser | null | undefined;
  isLoading: boolean;
  error: unknown;
  retry: () => void;
  /** True when the person signed out themselves (rather than the session running out). */
  signedOutDeliberately: boolean;
} {
  const session = useSession();
  return {
    user: session.data ? session.data.user : undefined,
    isLoading: session.isPending,
    error: session.isError && !session.data ? session.error : null,
    retry: () => void session.refetch(),
    signedOutDeliberately: session.data?.user === null && wasSignedOutDeliberately(),
  };
}

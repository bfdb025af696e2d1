import type { ReactNode } from 'react';
import { Navigate, Outlet, useLocation } from 'react-router';
import type { Role, SessionUser } from '@shared/api';
import { paths } from '../lib/paths';
import { ErrorState, LoadingState } from '../ui';
import { useCurrentUser } from '../features/session';
import { NotAllowedPage } from './not-allowed-page';

/** Pages below this need a signed-in person; others are sent to sign in, and come back after. */
export function RequireSignedIn() {
  const { user, isLoading, error, retry, signedOutDeliberately } = useCurrentUser();
  const location = useLocation();

  if (isLoading) return <LoadingState label="Checking your session…" />;
  if (error) return <ErrorState title="Gaugeline could not check your session" error={error} onRetry={retry} />;
  if (!user) {
    const back = location.pathname + location.search + location.hash;
    const to = signedOutDeliberately || back === paths.home ? paths.signIn : `${paths.signIn}?next=${encodeURIComponent(back)}`;
    return <Navigate to={to} replace />;
  }
  return <Outlet />;
}

/** Pages below this are for the given roles; others see a plain "not allowed" page. */
export function RequireRole({ roles }: { roles: readonly Role[] }) {
  const { user } = useCurrentUser();
  if (!user || !roles.includes(user.role)) return <NotAllowedPage />;
  return <Outlet />;
}

/** The signed-in person, inside RequireSignedIn. */
export function useSignedInUser(): SessionUser {
  const { user } = useCurrentUser();
  if (!user) throw new Error('useSignedInUser is only for pages behind RequireSignedIn');
  return user;
}

/** Shows its children only to the given roles. */
export function ForRoles({ roles, children, otherwise = null }: { roles: readonly Role[]; children: ReactNode; otherwise?: ReactNode }) {
  const { user } = useCurrentUser();
  return <>{user && roles.includes(user.role) ? children : otherwise}</>;
}

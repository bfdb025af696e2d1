import { NavLink } from 'react-router';
import type { SessionUser } from '@shared/api';
import { cx } from '../lib/cx';
import { paths } from '../lib/paths';
import { ROLE_LABELS } from '../lib/roles';
import { UnitsSwitch } from '../ui';
import { SignOutButton } from '../features/session';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  cx(
    'inline-flex min-h-10 items-center border-b-2 px-1 text-small font-semibold no-underline hover:no-underline',
    isActive ? 'border-copper text-ink' : 'border-transparent text-muted hover:border-rule hover:text-ink',
  );

/**
 * The main navigation. Everyone: Projects, Account, Sign out. Admins also get the
 * Admin group: People, Project access and Outgoing mail.
 */
export function MainNav({ user }: { user: SessionUser }) {
  const isAdmin = user.role === 'admin';
  return (
    <nav aria-label="Main" className="flex min-w-0 flex-1 basis-full flex-wrap items-center gap-x-6 gap-y-1 md:basis-auto">
      <ul className="flex items-center gap-4">
        <li>
          <NavLink to={paths.home} end className={linkClass}>
            Projects
          </NavLink>
        </li>
        <li>
          <NavLink to={paths.account} className={linkClass}>
            Account
          </NavLink>
        </li>
      </ul>
      {isAdmin && (
        <div className="flex items-center gap-3 border-l border-rule pl-4">
          <span id="nav-admin-label" className="ledger-label">
            Admin
          </span>
          <ul aria-labelledby="nav-admin-label" className="flex items-center gap-4">
            <li>
              <NavLink to={paths.adminPeople} className={linkClass}>
                People
              </NavLink>
            </li>
            <li>
              <NavLink to={paths.adminProjects} className={linkClass}>
                Project access
              </NavLink>
            </li>
            <li>
              <NavLink to={paths.adminOutbox} className={linkClass}>
                Outgoing mail
              </NavLink>
            </li>
          </ul>
        </div>
      )}
      <div className="ml-auto flex items-center gap-3">
        <UnitsSwitch className="no-print" />
        <p className="hidden text-small text-muted lg:block">
          <span className="sr-only">Signed in as </span>
          <span className="font-semibold text-ink">{user.name}</span>
          <span aria-hidden="true"> · </span>
          <span className="sr-only">, role </span>
          {ROLE_LABELS[user.role]}
        </p>
        <SignOutButton />
      </div>
    </nav>
  );
}

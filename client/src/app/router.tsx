import { createBrowserRouter } from 'react-router';
import { RootLayout } from '../routes/root-layout';
import { RouteError } from '../routes/route-error';
import { RequireRole, RequireSignedIn } from '../routes/guards';
import { SignInPage } from '../routes/sign-in-page';
import { ForgotPasswordPage } from '../routes/forgot-password-page';
import { SetPasswordPage } from '../routes/set-password-page';
import { ProjectsPage } from '../routes/projects-page';
import { ProjectPage } from '../routes/project-page';
import { RevisionPage } from '../routes/revision-page';
import { MemberPage } from '../routes/member-page';
import { RevisionChangesPage } from '../routes/revision-changes-page';
import { AccountPage } from '../routes/account-page';
import { AdminPeoplePage } from '../routes/admin-people-page';
import { AdminProjectsPage } from '../routes/admin-projects-page';
import { AdminOutboxMessagePage, AdminOutboxPage } from '../routes/admin-outbox-page';
import { AboutPage } from '../routes/about-page';
import { NotFoundPage } from '../routes/not-found-page';

/**
 * Routes:
 *   /sign-in              public
 *   /forgot-password      public: ask for a link to choose a new password
 *   /set-password         public: choose a password from an e-mailed link (#token=…)
 *   /about                public: scope and cautions
 *   /                     projects (create form for admin and engineer)
 *   /projects/:projectId  project overview: models, revisions, uploads
 *   /projects/:projectId/revisions/:revisionId                     a revision's results
 *   /projects/:projectId/revisions/:revisionId/members/:globalId   one member's sheet
 *   /projects/:projectId/revisions/:revisionId/changes?with=<id>  what changed since an earlier revision
 *   /account              your details, change password
 *   /admin/people         admin only
 *   /admin/projects       admin only (project access)
 *   /admin/outbox         admin only: outgoing mail; /admin/outbox/:mailId one message
 */
export function createRouter() {
  return createBrowserRouter([
    {
      element: <RootLayout />,
      errorElement: <RouteError />,
      children: [
        { path: 'sign-in', element: <SignInPage /> },
        { path: 'forgot-password', element: <ForgotPasswordPage /> },
        { path: 'set-password', element: <SetPasswordPage /> },
        { path: 'about', element: <AboutPage /> },
        {
          element: <RequireSignedIn />,
          children: [
            { index: true, element: <ProjectsPage /> },
            { path: 'projects/:projectId', element: <ProjectPage /> },
            { path: 'projects/:projectId/revisions/:revisionId', element: <RevisionPage />, handle: { wide: true } },
            { path: 'projects/:projectId/revisions/:revisionId/members/:globalId', element: <MemberPage />, handle: { wide: true } },
            { path: 'projects/:projectId/revisions/:revisionId/changes', element: <RevisionChangesPage />, handle: { wide: true } },
            { path: 'account', element: <AccountPage /> },
            {
              path: 'admin',
              element: <RequireRole roles={['admin']} />,
              children: [
                { path: 'people', element: <AdminPeoplePage /> },
                { path: 'projects', element: <AdminProjectsPage /> },
                { path: 'outbox', element: <AdminOutboxPage /> },
                { path: 'outbox/:mailId', element: <AdminOutboxMessagePage /> },
              ],
            },
            { path: '*', element: <NotFoundPage /> },
          ],
        },
      ],
    },
  ]);
}

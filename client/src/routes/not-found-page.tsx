import { Link } from 'react-router';
import { usePageTitle } from '../lib/page-title';
import { paths } from '../lib/paths';
import { PageHeader } from '../ui';

export function NotFoundPage() {
  usePageTitle('Page not found');
  return (
    <div className="max-w-prose">
      <PageHeader title="Page not found" eyebrow="Error 404" />
      <p>There is no page at this address. It may have moved, or the link may be mistyped.</p>
      <p className="mt-block">
        <Link to={paths.home}>Go to projects</Link>
      </p>
    </div>
  );
}

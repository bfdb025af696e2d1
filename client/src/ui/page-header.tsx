import type { ReactNode } from 'react';

interface PageHeaderProps {
  title: ReactNode;
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
}

/**
 * The page's one h1. It can take focus (tabIndex -1) so that after navigation the
 * layout moves focus here and screen readers announce the new page.
 */
export function PageHeader({ title, eyebrow, description, actions }: PageHeaderProps) {
  return (
    <header className="mb-block flex flex-wrap items-end justify-between gap-4 border-b border-rule pb-4">
      <div className="min-w-0">
        {eyebrow && <p className="ledger-label mb-1">{eyebrow}</p>}
        <h1 tabIndex={-1} data-page-title className="text-headline font-bold tracking-tight text-ink">
          {title}
        </h1>
        {description && <div className="mt-1.5 max-w-prose text-muted">{description}</div>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}

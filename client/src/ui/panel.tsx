import { useId, type ReactNode } from 'react';
import { cx } from '../lib/cx';

/** A plain card: white sheet, hairline rule. */
export function Card({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <div data-card className={cx('rounded-card border border-rule bg-card', className)}>
      {children}
    </div>
  );
}

interface PanelProps {
  title: ReactNode;
  /** Small capitals line above the title, e.g. a reference or category. */
  eyebrow?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  /** Heading level inside the page outline. */
  level?: 2 | 3;
  className?: string;
}

/** A titled section of a page; the title names the region for screen readers. */
export function Panel({ title, eyebrow, description, actions, children, level = 2, className }: PanelProps) {
  const headingId = useId();
  const Heading = level === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby={headingId} data-card className={cx('rounded-card border border-rule bg-card', className)}>
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-rule px-5 py-4">
        <div className="min-w-0">
          {eyebrow && <p className="ledger-label mb-0.5">{eyebrow}</p>}
          <Heading id={headingId} className="text-title font-semibold text-ink">
            {title}
          </Heading>
          {description && <p className="mt-1 text-small text-muted">{description}</p>}
        </div>
        {actions && <div className="flex shrink-0 flex-wrap items-center gap-2">{actions}</div>}
      </header>
      <div className="px-5 py-4">{children}</div>
    </section>
  );
}

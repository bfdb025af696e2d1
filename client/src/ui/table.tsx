import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { cx } from '../lib/cx';

/**
 * Ruled ledger tables. The caption names the table for screen readers (and can be
 * shown); the wrapper scrolls sideways on narrow screens instead of squashing columns.
 */
export function Table({
  caption,
  captionVisible = false,
  framed = false,
  children,
  className,
}: {
  caption: string;
  captionVisible?: boolean;
  /** Draw the table on its own white sheet (when it is not already inside a Panel). */
  framed?: boolean;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div data-card={framed || undefined} className={cx('overflow-x-auto', framed && 'rounded-card border border-rule bg-card', className)}>
      <table className="w-full border-collapse text-left text-small tabular-nums">
        <caption className={captionVisible ? 'mb-2 text-left font-semibold text-ink' : 'sr-only'}>{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function THead({ children }: { children: ReactNode }) {
  return <thead className="border-b-2 border-ink/70 bg-ledger">{children}</thead>;
}

export function TBody({ children }: { children: ReactNode }) {
  return <tbody className="divide-y divide-rule">{children}</tbody>;
}

export function Tr({ children, className }: { children: ReactNode; className?: string }) {
  return <tr className={cx('align-top', className)}>{children}</tr>;
}

interface ThProps extends ThHTMLAttributes<HTMLTableCellElement> {
  numeric?: boolean;
}

export function Th({ children, numeric, className, scope = 'col', ...rest }: ThProps) {
  return (
    <th scope={scope} className={cx('ledger-label px-3 py-2 align-bottom whitespace-nowrap', numeric && 'text-right', className)} {...rest}>
      {children}
    </th>
  );
}

interface TdProps extends TdHTMLAttributes<HTMLTableCellElement> {
  numeric?: boolean;
}

export function Td({ children, numeric, className, ...rest }: TdProps) {
  return (
    <td className={cx('px-3 py-2.5', numeric && 'text-right whitespace-nowrap', className)} {...rest}>
      {children}
    </td>
  );
}

/** A row header cell (the row's name), for tables where each row is one thing. */
export function RowHeader({ children, className }: { children: ReactNode; className?: string }) {
  return (
    <th scope="row" className={cx('px-3 py-2.5 font-semibold text-ink', className)}>
      {children}
    </th>
  );
}

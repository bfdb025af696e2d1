import type { ButtonHTMLAttributes, Ref } from 'react';
import { cx } from '../lib/cx';
import { Spinner } from './spinner';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';
export type ButtonSize = 'md' | 'sm';

const base =
  'inline-flex items-center justify-center gap-2 rounded-control border font-semibold whitespace-nowrap transition-colors ' +
  'disabled:cursor-not-allowed disabled:border-rule disabled:bg-ledger disabled:text-muted aria-busy:cursor-progress';

const variants: Record<ButtonVariant, string> = {
  primary: 'border-copper bg-copper text-white hover:bg-copper-deep hover:border-copper-deep',
  secondary: 'border-edge bg-card text-ink hover:bg-ledger',
  quiet: 'border-transparent bg-transparent text-copper underline-offset-4 hover:underline hover:text-copper-deep',
  danger: 'border-fault bg-card text-fault hover:bg-fault-wash',
};

const sizes: Record<ButtonSize, string> = {
  md: 'min-h-10 px-4 text-body',
  sm: 'min-h-8 px-3 text-small',
};

/** Classes for things that look like buttons but are links (router Links). */
export function buttonClass(variant: ButtonVariant = 'primary', size: ButtonSize = 'md', extra?: string): string {
  return cx(base, variants[variant], sizes[size], 'no-underline hover:no-underline', extra);
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Shows a spinner and blocks further presses while work is under way. */
  busy?: boolean;
  ref?: Ref<HTMLButtonElement>;
}

export function Button({ variant = 'primary', size = 'md', busy = false, type = 'button', className, disabled, children, onClick, ...rest }: ButtonProps) {
  // While busy the button keeps its look but ignores presses (and so blocks a second submit).
  return (
    <button
      type={type}
      className={cx(base, variants[variant], sizes[size], className)}
      disabled={disabled}
      aria-disabled={busy || undefined}
      aria-busy={busy || undefined}
      onClick={(event) => {
        if (busy) {
          event.preventDefault();
          return;
        }
        onClick?.(event);
      }}
      {...rest}
    >
      {busy && <Spinner size="sm" decorative />}
      {children}
    </button>
  );
}

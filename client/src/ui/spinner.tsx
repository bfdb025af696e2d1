import { cx } from '../lib/cx';

interface SpinnerProps {
  size?: 'sm' | 'md';
  /** When true the spinner is hidden from assistive technology (the surrounding text says what is happening). */
  decorative?: boolean;
  label?: string;
}

/** A ruled dial that turns; still under reduced motion. */
export function Spinner({ size = 'md', decorative = false, label = 'Loading' }: SpinnerProps) {
  const px = size === 'sm' ? 'size-4' : 'size-6';
  return (
    <svg
      className={cx(px, 'shrink-0 animate-spin motion-reduce:animate-none')}
      viewBox="0 0 24 24"
      fill="none"
      role={decorative ? undefined : 'img'}
      aria-hidden={decorative || undefined}
      aria-label={decorative ? undefined : label}
    >
      <circle cx="12" cy="12" r="9" stroke="currentColor" strokeOpacity="0.25" strokeWidth="2.5" />
      <path d="M21 12a9 9 0 0 0-9-9" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
    </svg>
  );
}

/** A whole region waiting for data. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-6 text-muted">
      <Spinner decorative />
      <span>{label}</span>
    </div>
  );
}

import type { ReactNode, Ref } from 'react';
import { cx } from '../lib/cx';

export type NoticeTone = 'info' | 'success' | 'error' | 'caution';

const tones: Record<NoticeTone, { box: string; mark: string; prefix: string }> = {
  info: { box: 'border-l-ink/60 bg-ledger', mark: 'text-ink', prefix: 'Note' },
  success: { box: 'border-l-sound bg-sound-wash', mark: 'text-sound', prefix: 'Done' },
  error: { box: 'border-l-fault bg-fault-wash', mark: 'text-fault', prefix: 'Problem' },
  caution: { box: 'border-l-heed bg-heed-wash', mark: 'text-heed', prefix: 'Caution' },
};

interface NoticeProps {
  tone?: NoticeTone;
  title?: ReactNode;
  children?: ReactNode;
  /** Lets a form move focus here when the server refuses. */
  ref?: Ref<HTMLDivElement>;
  className?: string;
}

/**
 * A message in the flow of the page. Errors are announced at once (role=alert),
 * success politely (role=status); info and cautions are plain text.
 */
export function Notice({ tone = 'info', title, children, ref, className }: NoticeProps) {
  const t = tones[tone];
  const role = tone === 'error' ? 'alert' : tone === 'success' ? 'status' : undefined;
  return (
    <div ref={ref} tabIndex={-1} role={role} className={cx('rounded-card border border-l-4 border-rule px-4 py-3 text-small text-ink', t.box, className)}>
      {title ? (
        <p className={cx('font-semibold', t.mark)}>
          <span className="sr-only">{t.prefix}: </span>
          {title}
        </p>
      ) : (
        <span className="sr-only">{t.prefix}: </span>
      )}
      {children && <div className={cx(title ? 'mt-1' : undefined)}>{children}</div>}
    </div>
  );
}

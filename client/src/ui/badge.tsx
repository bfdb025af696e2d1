import type { ReactNode } from 'react';
import { cx } from '../lib/cx';

export type BadgeTone = 'neutral' | 'copper' | 'sound' | 'fault' | 'muted';

const tones: Record<BadgeTone, string> = {
  neutral: 'border-ink/40 text-ink bg-card',
  copper: 'border-copper text-copper bg-copper-wash',
  sound: 'border-sound text-sound bg-sound-wash',
  fault: 'border-fault text-fault bg-fault-wash',
  muted: 'border-rule text-muted bg-ledger',
};

/** A short stamped label: a role, a status. Text carries the meaning, colour only supports it. */
export function Badge({ tone = 'neutral', children }: { tone?: BadgeTone; children: ReactNode }) {
  return (
    <span className={cx('inline-flex items-center rounded-control border px-1.5 py-px text-fine font-semibold tracking-wide', tones[tone])}>
      {children}
    </span>
  );
}

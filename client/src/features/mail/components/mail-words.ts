import { MAIL_STATUS_LABELS, type OutboxEntry } from '@shared/api';
import type { BadgeTone } from '../../../ui';

/** What each kind of message is, in the outbox's words. */
const KIND_LABELS: Record<string, string> = {
  'import-finished': 'Import checked',
  'import-failed': 'Import not checked',
  'critical-members': 'Critical members',
  invitation: 'Invitation',
  'password-reset': 'Password link',
};

export function kindLabel(kind: string): string {
  return KIND_LABELS[kind] ?? kind.replace(/-/g, ' ');
}

export const STATUS_TONES: Record<OutboxEntry['status'], BadgeTone> = {
  queued: 'neutral',
  sending: 'neutral',
  sent: 'sound',
  retrying: 'copper',
  failed: 'fault',
};

export const statusLabel = (status: OutboxEntry['status']) => MAIL_STATUS_LABELS[status];

/** Only messages that are waiting for another attempt, or that gave up, can be sent again by hand. */
export const canRetry = (m: OutboxEntry) => m.status === 'retrying' || m.status === 'failed';

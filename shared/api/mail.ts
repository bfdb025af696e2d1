import { z } from 'zod';

export const MAIL_STATUSES = ['queued', 'sending', 'sent', 'retrying', 'failed'] as const;
export const MAIL_STATUS_LABELS: Record<(typeof MAIL_STATUSES)[number], string> = {
  queued: 'Waiting to go',
  sending: 'Going out',
  sent: 'Delivered to the mail service',
  retrying: 'Mail service unreachable — will try again',
  failed: 'Gave up — retry by hand',
};

/** One outbox entry (GET /api/mail, admins). */
export const outboxEntrySchema = z.object({
  id: z.number().int(),
  kind: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  status: z.enum(MAIL_STATUSES),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
  attachments: z.array(z.object({ filename: z.string(), contentType: z.string() })),
  /** Only in GET /api/mail/:id. */
  text: z.string().optional(),
});
export type OutboxEntry = z.infer<typeof outboxEntrySchema>;
export const outboxListSchema = z.object({ messages: z.array(outboxEntrySchema) });

/** POST /api/projects/:pid/revisions/:rid/send-critical */
export const sendCriticalRequestSchema = z.object({
  /** Project members' e-mails and typed addresses together. */
  recipients: z.array(z.string().trim().max(254)).min(1, 'Give at least one recipient').max(50),
  message: z.string().trim().max(5000).default(''),
  attach: z.array(z.enum(['csv', 'pdf'])).min(1, 'Attach the CSV, the PDF or both').default(['csv', 'pdf']),
  /** Which members: utilisation at or above this value (default 0.85: tight and over). */
  minUtilisation: z.number().min(0).max(100).default(0.85),
});
export type SendCriticalRequest = z.input<typeof sendCriticalRequestSchema>;

import { Router } from 'express';
import type { OutboxEntry } from '@shared/api/mail';
import { MailMessageModel } from '../../db/models/mail-message';
import { requireRole } from '../../http/require-user';
import { parseId } from '../../http/validate';
import { errors } from '../../http/errors';
import type { MailService } from '../../mail/mail-service';

function present(m: MailMessageModel, withText = false): OutboxEntry {
  return {
    id: m.id,
    kind: m.kind,
    to: m.toAddresses,
    subject: m.subject,
    status: m.status,
    attempts: m.attempts,
    lastError: m.lastError ?? null,
    nextAttemptAt: m.status === 'sent' || !m.nextAttemptAt ? null : m.nextAttemptAt.toISOString(),
    sentAt: m.sentAt ? m.sentAt.toISOString() : null,
    createdAt: m.createdAt.toISOString(),
    attachments: m.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType })),
    // One-time links are for their addressee only: an admin reading the outbox must not be able to use them.
    ...(withText ? { text: m.textBody.replace(/(#token=)[A-Za-z0-9_-]+/g, '$1(hidden)') } : {}),
  };
}

/** The outbox: every message Gaugeline has sent or will send, for admins. */
export function outboxRoutes(mail: MailService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', async (_req, res) => {
    const rows = await MailMessageModel.findAll({ order: [['id', 'DESC']], limit: 500, attributes: { exclude: ['textBody'] } });
    res.json({ messages: rows.map((m) => present(m)) });
  });

  router.get('/:mailId', async (req, res) => {
    const row = await MailMessageModel.findByPk(parseId(req.params.mailId, 'That message'));
    if (!row) throw errors.notFound('That message');
    res.json(present(row, true));
  });

  router.post('/:mailId/retry', async (req, res) => {
    res.json(present(await mail.retry(parseId(req.params.mailId, 'That message'))));
  });

  return router;
}

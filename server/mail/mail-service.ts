import { z } from 'zod';
import { Op, type Transaction } from 'sequelize';
import nodemailer, { type Transporter } from 'nodemailer';
import type { AppConfig } from '../config/config';
import type { Logger } from '../logger';
import { MailMessageModel, type StoredAttachment } from '../db/models/mail-message';
import { errors } from '../http/errors';

export interface OutgoingMail {
  kind: 'import-finished' | 'import-failed' | 'critical-members' | 'invitation' | 'password-reset';
  to: string[];
  subject: string;
  text: string;
  attachments?: StoredAttachment[];
  projectId?: number | null;
  createdById?: number | null;
}

const address = z.string().trim().toLowerCase().email();
const MAX_ATTEMPTS = 8;

/** Checks every address; a bad one is refused by name before anything is queued. */
export function validateRecipients(to: string[]): string[] {
  const bad = to.filter((a) => !address.safeParse(a).success);
  if (bad.length) throw errors.validation(`Not an e-mail address: ${bad.join(', ')}`, { recipients: `Not an e-mail address: ${bad.join(', ')}` });
  if (!to.length) throw errors.validation('Give at least one recipient.', { recipients: 'Give at least one recipient.' });
  return [...new Set(to.map((a) => a.trim().toLowerCase()))];
}

/**
 * The outgoing-mail queue. Messages are stored first and sent after, so a mail service
 * that is down loses nothing: failed sends are retried with growing pauses, and admins
 * can read every message and retry it from the outbox.
 */
export class MailService {
  private transport: Transporter;
  private timer: NodeJS.Timeout | undefined;
  private running = false;
  private stopped = false;

  constructor(
    private readonly config: AppConfig,
    smtp: { host: string; port: number; secure: boolean; user?: string; password?: string },
    private readonly logger: Logger,
  ) {
    this.transport = nodemailer.createTransport({
      host: smtp.host,
      port: smtp.port,
      secure: smtp.secure,
      ignoreTLS: !smtp.secure && smtp.host === '127.0.0.1',
      auth: smtp.user ? { user: smtp.user, pass: smtp.password ?? '' } : undefined,
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 15_000,
    });
  }

  start(): void {
    this.timer = setInterval(() => this.kick(), Math.min(5_000, this.config.mail.retryMs));
  }

  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    while (this.running) await new Promise((r) => setTimeout(r, 20));
    this.transport.close();
  }

  async enqueue(mail: OutgoingMail, transaction?: Transaction): Promise<MailMessageModel> {
    const row = await MailMessageModel.create(
      {
        kind: mail.kind,
        toAddresses: validateRecipients(mail.to),
        subject: mail.subject.slice(0, 255),
        textBody: mail.text,
        attachments: mail.attachments ?? [],
        projectId: mail.projectId ?? null,
        createdById: mail.createdById ?? null,
        status: 'queued',
        nextAttemptAt: new Date(),
      },
      { transaction },
    );
    if (transaction) transaction.afterCommit(() => this.kick());
    else this.kick();
    return row;
  }

  /** Puts a message back in line at once (admins, from the outbox). */
  async retry(id: number): Promise<MailMessageModel> {
    const row = await MailMessageModel.findByPk(id);
    if (!row) throw errors.notFound('That message');
    if (row.status === 'sent') throw errors.conflict('That message has already been sent.');
    await row.update({ status: 'retrying', nextAttemptAt: new Date() });
    this.kick();
    return row;
  }

  kick(): void {
    if (this.running || this.stopped) return;
    this.running = true;
    void this.deliverDue()
      .catch((err) => this.logger.warn(`mail: ${(err as Error).message}`))
      .finally(() => (this.running = false));
  }

  private async deliverDue(): Promise<void> {
    for (;;) {
      if (this.stopped) return;
      const due = await MailMessageModel.findOne({
        where: {
          [Op.or]: [
            { status: { [Op.in]: ['queued', 'retrying'] }, nextAttemptAt: { [Op.lte]: new Date() } },
            // A send interrupted by a crash or restart is tried again after a while.
            { status: 'sending', updatedAt: { [Op.lt]: new Date(Date.now() - 10 * 60_000) } },
          ],
        },
        order: [['nextAttemptAt', 'ASC'], ['id', 'ASC']],
      });
      if (!due) return;
      // Claim it: another app process sharing the database may be delivering too.
      const [claimed] = await MailMessageModel.update({ status: 'sending' }, { where: { id: due.id, status: due.status } });
      if (claimed !== 1) continue;
      await this.deliver(due);
    }
  }

  private async deliver(row: MailMessageModel): Promise<void> {
    try {
      await this.transport.sendMail({
        from: this.config.mail.from,
        to: row.toAddresses,
        subject: row.subject,
        text: row.textBody,
        attachments: row.attachments.map((a) => ({ filename: a.filename, contentType: a.contentType, path: a.path })),
      });
      await row.update({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null });
    } catch (err) {
      const attempts = row.attempts + 1;
      const wait = Math.min(3_600_000, this.config.mail.retryMs * 2 ** (attempts - 1));
      await row.update({
        status: attempts >= MAX_ATTEMPTS ? 'failed' : 'retrying',
        attempts,
        lastError: (err as Error).message.slice(0, 1000),
        nextAttemptAt: new Date(Date.now() + wait),
      });
      this.logger.warn(`mail ${row.id} not sent (attempt ${attempts}): ${(err as Error).message}`);
    }
  }
}

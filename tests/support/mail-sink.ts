import { readdirSync, readFileSync, existsSync } from 'node:fs';
import path from 'node:path';
import { simpleParser, type ParsedMail } from 'mailparser';
import { waitFor } from './wait-for';

/** Messages the local mail service has kept, parsed by an independent reader. */
export async function sinkMessages(dir: string): Promise<ParsedMail[]> {
  if (!existsSync(dir)) return [];
  const files = readdirSync(dir).filter((f) => f.endsWith('.eml')).sort();
  return Promise.all(files.map((f) => simpleParser(readFileSync(path.join(dir, f)))));
}

/** Waits for a message to `to` whose subject matches. */
export async function waitForMail(dir: string, to: string, subject: RegExp, timeoutMs = 30_000): Promise<ParsedMail> {
  const found = await waitFor(
    async () => (await sinkMessages(dir)).find((m) => (m.to && !Array.isArray(m.to) ? m.to.text : '').includes(to) && subject.test(m.subject ?? '')),
    (m) => m !== undefined,
    timeoutMs,
    200,
  );
  if (!found) throw new Error(`no mail to ${to} matching ${subject}`);
  return found;
}

/** The one-time token in a set-password link. */
export function tokenFrom(mail: ParsedMail): string {
  const m = /set-password#token=([A-Za-z0-9_-]+)/.exec(mail.text ?? '');
  if (!m) throw new Error('no set-password link in the message');
  return m[1];
}

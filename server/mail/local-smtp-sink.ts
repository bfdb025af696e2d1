import { SMTPServer } from 'smtp-server';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

export interface SmtpSink {
  host: string;
  port: number;
  dir: string;
  close(): Promise<void>;
}

/**
 * A mail service on loopback that accepts every message and keeps it as an .eml file,
 * in place of a hosted provider for development and tests. No TLS, no auth: it listens
 * on 127.0.0.1 only.
 */
export async function startSmtpSink(dir: string, port = 0): Promise<SmtpSink> {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    secure: false,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 50 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomBytes(4).toString('hex')}.eml`;
        const envelope = `X-Gaugeline-Envelope-To: ${session.envelope.rcptTo.map((r) => r.address).join(', ')}\r\n`;
        writeFileSync(path.join(dir, name), Buffer.concat([Buffer.from(envelope), ...chunks]));
        callback();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  return {
    host: '127.0.0.1',
    port: typeof address === 'object' && address ? address.port : port,
    dir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

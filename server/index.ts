import type { Server } from 'node:http';
import { loadConfig, ConfigError, type AppConfig } from './config/config';
import { createDatabase } from './db/database';
import { migrateToLatest } from './db/migrate';
import { countDemoAccounts, seedDemoIfEmpty } from './db/seed/demo-seed';
import { seedDemoModel } from './db/seed/demo-model-seed';
import { fileURLToPath } from 'node:url';
import { createApp } from './app';
import { createLogger } from './logger';
import { createFileStore } from './storage/file-store-factory';
import { ImportRunner } from './imports/import-runner';
import { MailService } from './mail/mail-service';
import { startSmtpSink, type SmtpSink } from './mail/local-smtp-sink';
import { notifyImportOutcome } from './mail/import-notifications';
import path from 'node:path';
import { closeExportPool } from './exports/export-pool';

const SAMPLES_DIR = fileURLToPath(new URL('../samples', import.meta.url));

export interface RunningServer {
  url: string;
  config: AppConfig;
  imports: ImportRunner;
  mail: MailService;
  /** The local mail service on loopback, when no real SMTP server is configured. */
  mailSink: SmtpSink | null;
  stop(): Promise<void>;
}

/** Start-up: config, database, migrations, demo seed, HTTP. Used by npm start and by tests. */
export async function startServer(env: Record<string, string | undefined> = process.env, quiet = false): Promise<RunningServer> {
  const config = loadConfig(env);
  const logger = createLogger(quiet);
  const sequelize = createDatabase(config.db);
  await sequelize.authenticate();
  const applied = await migrateToLatest(sequelize);
  if (applied.length) logger.info(`applied migrations: ${applied.join(', ')}`);
  if (config.env === 'production' && (await countDemoAccounts()) > 0) {
    await sequelize.close();
    throw new ConfigError(['database: demo accounts exist; remove them before running in production']);
  }
  const seeded = config.demoSeed && (await seedDemoIfEmpty(sequelize));
  if (seeded) logger.info('seeded the demo project and accounts');

  const store = createFileStore(config);
  if (seeded && config.demoModels && (await seedDemoModel(store, SAMPLES_DIR))) logger.info('queued the demo model for import');
  // No SMTP server configured: keep every message in a local mail service on loopback.
  const mailSink = config.mail.smtp ? null : await startSmtpSink(path.resolve(config.dataDir, 'mail-sink'));
  const mail = new MailService(config, config.mail.smtp ?? { host: mailSink!.host, port: mailSink!.port, secure: false }, logger);
  const imports = new ImportRunner(sequelize, config, store, logger, (id) => void notifyImportOutcome(mail, config, logger, id));
  const handle = createApp(config, sequelize, logger, { store, mail, onImportQueued: () => imports.kick() });
  const server: Server = await new Promise((resolve, reject) => {
    const s = handle.app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : config.port;
  const url = `http://${config.host}:${port}`;
  // With no PUBLIC_URL, links in e-mails point at where this server really listens (PORT=0 picks a port).
  if (!env.PUBLIC_URL) config.publicUrl = url;
  imports.start();
  mail.start();
  mail.kick();
  return {
    url,
    config,
    imports,
    mail,
    mailSink,
    async stop() {
      await imports.stop();
      await mail.stop();
      await mailSink?.close();
      await closeExportPool();
      handle.close();
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections();
      await closed;
      await sequelize.close();
    },
  };
}

async function main(): Promise<void> {
  let running: RunningServer;
  try {
    running = await startServer();
  } catch (err) {
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(78); // EX_CONFIG
    }
    throw err;
  }
  console.log(`Gaugeline is running at ${running.url}`);
  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal}: stopping Gaugeline`);
    await running.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

if (import.meta.url === `file://${process.argv[1]}`) {
  main().catch((err) => {
    console.error(err instanceof Error ? err.stack : err);
    process.exit(1);
  });
}

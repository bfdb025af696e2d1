// npm start (after scripts/start.sh has installed what was missing): build the client,
// start the private MariaDB, then the app with demo data, and stop both cleanly on Ctrl-C.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startMariaInstance, ensureDatabase } from './db/mariadb-instance';
import { buildClientIfStale } from './lib/build-client';
import { loadOrCreateSecrets } from './lib/local-secrets';
import { startServer } from '../server/index';
import { ConfigError } from '../server/config/config';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/seed/demo-seed';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);

async function main(): Promise<void> {
  const dataDir = path.resolve(process.env.DATA_DIR || '.data');
  const dbPort = Number(process.env.DB_PORT || 3407);
  const secrets = loadOrCreateSecrets(dataDir);
  buildClientIfStale(root);

  const db = await startMariaInstance({ dir: path.join(dataDir, 'mariadb'), port: dbPort });
  const dbName = process.env.DB_NAME || 'gaugeline';
  const dbUser = process.env.DB_USER || 'gaugeline';
  await ensureDatabase(db, { name: dbName, user: dbUser, password: secrets.dbPassword });

  let server;
  try {
    server = await startServer({
      ...process.env,
      DATA_DIR: dataDir,
      DB_HOST: '127.0.0.1',
      DB_PORT: String(dbPort),
      DB_NAME: dbName,
      DB_USER: dbUser,
      DB_PASSWORD: process.env.DB_PASSWORD || secrets.dbPassword,
      SESSION_SECRET: process.env.SESSION_SECRET || secrets.sessionSecret,
    });
  } catch (err) {
    await db.stop();
    if (err instanceof ConfigError) {
      console.error(err.message);
      process.exit(78);
    }
    throw err;
  }

  console.log('');
  console.log(`Gaugeline is running at ${server.url}`);
  if (server.config.demoSeed) {
    console.log(`Demo sign-ins (password "${DEMO_PASSWORD}"):`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(34)} ${a.role}`);
  }
  console.log('Press Ctrl-C to stop the app and its database.');

  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`\n${signal}: stopping the app and the database...`);
    await server.stop().catch((e) => console.error(e));
    await db.stop();
    console.log('Stopped. Data is kept in', dataDir);
    process.exit(0);
  };
  process.on('SIGINT', () => void shutdown('SIGINT'));
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});

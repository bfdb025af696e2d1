import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startServer, type RunningServer } from '../../server/index';
import { createTestDatabase, testDbServer } from './test-db';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface TestApp {
  url: string;
  server: RunningServer;
  dbName: string;
  /** Stops the server and drops its database. */
  stop(): Promise<void>;
  /** Drops the database only (for tests that stopped the server themselves). */
  dropDatabase(): Promise<void>;
}

/**
 * Run one in-process app at a time: Sequelize model classes bind to the last connection
 * made in a process. For several app processes use spawn-app.ts.
 *
 * The real app (real MariaDB, migrations, demo seed, built client) on a free port,
 * in a database of its own. `env` overrides configuration for one suite.
 */
export async function startTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const s = testDbServer();
  const db = await createTestDatabase();
  const server = await startServer(
    {
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      DB_HOST: s.host,
      DB_PORT: String(s.port),
      DB_NAME: db.name,
      DB_USER: s.user,
      DB_PASSWORD: s.password,
      SESSION_SECRET: randomBytes(24).toString('hex'),
      DATA_DIR: path.join(root, '.test-data', db.name),
      CLIENT_DIST: path.join(root, 'client/dist'),
      DEMO_SEED: 'on',
      // Suites that want the demo model queued at start-up set DEMO_MODELS=on.
      DEMO_MODELS: 'off',
      ...env,
    },
    true,
  );
  return {
    url: server.url,
    server,
    dbName: db.name,
    async stop() {
      await server.stop();
      await db.drop();
    },
    dropDatabase: () => db.drop(),
  };
}

import { randomBytes } from 'node:crypto';
import mariadb from 'mariadb';

export interface TestDbServer {
  host: string;
  port: number;
  user: string;
  password: string;
  socket?: string;
}

/** The throwaway MariaDB that scripts/test.ts started for this run. */
export function testDbServer(): TestDbServer {
  const { TEST_DB_HOST, TEST_DB_PORT, TEST_DB_USER, TEST_DB_PASSWORD, TEST_DB_SOCKET } = process.env;
  if (!TEST_DB_PORT || !TEST_DB_USER) {
    throw new Error('No test database: run these tests through `npm test` (it starts a throwaway MariaDB).');
  }
  return { host: TEST_DB_HOST ?? '127.0.0.1', port: Number(TEST_DB_PORT), user: TEST_DB_USER, password: TEST_DB_PASSWORD ?? '', socket: TEST_DB_SOCKET };
}

async function adminQuery(sql: string): Promise<void> {
  const s = testDbServer();
  const conn = await mariadb.createConnection({ host: s.host, port: s.port, user: s.user, password: s.password });
  try {
    await conn.query(sql);
  } finally {
    await conn.end();
  }
}

/** A fresh, empty database for one test file; drop() removes it. */
export async function createTestDatabase(): Promise<{ name: string; drop(): Promise<void> }> {
  const name = `gl_t_${randomBytes(5).toString('hex')}`;
  await adminQuery(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  return { name, drop: () => adminQuery(`DROP DATABASE IF EXISTS \`${name}\``) };
}

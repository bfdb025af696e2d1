import { spawn, execFile, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, openSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);

export interface MariaInstance {
  dir: string;
  port: number;
  socket: string;
  /** Runs SQL as the instance's root user over the socket. */
  sql(statements: string): Promise<string>;
  /** Stops the server if this process started it. */
  stop(): Promise<void>;
}

function findBinary(name: string): string {
  for (const dir of (process.env.PATH ?? '').split(':').concat(['/usr/sbin', '/usr/bin', '/sbin'])) {
    const candidate = path.join(dir, name);
    if (dir && existsSync(candidate)) return candidate;
  }
  throw new Error(`${name} was not found; install Debian's mariadb-server package`);
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/**
 * Starts (or reuses) a private MariaDB server: its own data folder, a socket in that
 * folder, TCP on 127.0.0.1 only. Nothing system-wide is read (--no-defaults).
 */
export async function startMariaInstance(options: { dir: string; port: number; quiet?: boolean }): Promise<MariaInstance> {
  const dir = path.resolve(options.dir);
  const dataDir = path.join(dir, 'data');
  const socket = path.join(dir, 'mysqld.sock');
  const pidFile = path.join(dir, 'mysqld.pid');
  mkdirSync(dir, { recursive: true });
  const asRoot = process.getuid?.() === 0 ? ['--user=root'] : [];

  const client = findBinary('mariadb');
  const sql = async (statements: string) =>
    (await run(client, ['--no-defaults', `--socket=${socket}`, '-uroot', '--batch', '--skip-column-names', '-e', statements])).stdout;

  const runningPid = existsSync(pidFile) ? Number(readFileSync(pidFile, 'utf8').trim()) : 0;
  if (runningPid && isAlive(runningPid) && existsSync(socket)) {
    if (!options.quiet) console.log(`Reusing the MariaDB server already running on port ${options.port} (pid ${runningPid}).`);
    return { dir, port: options.port, socket, sql, stop: async () => {} };
  }

  if (!existsSync(path.join(dataDir, 'mysql'))) {
    if (!options.quiet) console.log(`Creating a MariaDB data folder in ${dataDir} ...`);
    await run(findBinary('mariadb-install-db'), [
      '--no-defaults', ...asRoot, `--datadir=${dataDir}`,
      '--auth-root-authentication-method=socket', '--skip-test-db', '--skip-name-resolve',
    ]);
  }

  const log = openSync(path.join(dir, 'error.log'), 'a');
  const child: ChildProcess = spawn(
    findBinary('mariadbd'),
    [
      '--no-defaults', ...asRoot, `--datadir=${dataDir}`, `--socket=${socket}`, `--port=${options.port}`,
      '--bind-address=127.0.0.1', `--pid-file=${pidFile}`, `--log-error=${path.join(dir, 'error.log')}`,
      '--skip-name-resolve', '--character-set-server=utf8mb4', '--collation-server=utf8mb4_unicode_ci',
      // A 20,000-member revision is about 150 MB of rows written in one transaction: a pool and a
      // redo log smaller than that make the import flush pages and checkpoint mid-transaction.
      '--innodb-buffer-pool-size=1G', '--innodb-log-file-size=512M', '--max-connections=300',
    ],
    { stdio: ['ignore', log, log], detached: false },
  );
  let exited = false;
  child.once('exit', () => (exited = true));

  const admin = findBinary('mariadb-admin');
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (exited) throw new Error(`MariaDB did not start; see ${path.join(dir, 'error.log')} (is port ${options.port} in use?)`);
    try {
      await run(admin, ['--no-defaults', `--socket=${socket}`, '-uroot', 'ping']);
      break;
    } catch {
      if (Date.now() > deadline) throw new Error(`MariaDB did not answer within 30 s; see ${path.join(dir, 'error.log')}`);
      await sleep(100);
    }
  }

  return {
    dir,
    port: options.port,
    socket,
    sql,
    async stop() {
      if (exited) return;
      const done = new Promise<void>((resolve) => child.once('exit', () => resolve()));
      child.kill('SIGTERM');
      await Promise.race([done, sleep(20_000)]);
      if (!exited) child.kill('SIGKILL');
    },
  };
}

const quoteIdent = (s: string) => '`' + s.replace(/`/g, '``') + '`';
const quoteString = (s: string) => "'" + s.replace(/\\/g, '\\\\').replace(/'/g, "\\'") + "'";

/**
 * Creates the application database and user (idempotent). `global` grants rights on
 * every database, which only the test runner uses (each test file makes its own database).
 */
export async function ensureDatabase(
  instance: MariaInstance,
  db: { name: string; user: string; password: string; global?: boolean },
): Promise<void> {
  const user = `${quoteString(db.user)}@'127.0.0.1'`;
  const scope = db.global ? '*.*' : `${quoteIdent(db.name)}.*`;
  await instance.sql(
    [
      `CREATE DATABASE IF NOT EXISTS ${quoteIdent(db.name)} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
      `CREATE USER IF NOT EXISTS ${user} IDENTIFIED BY ${quoteString(db.password)}`,
      `ALTER USER ${user} IDENTIFIED BY ${quoteString(db.password)}`,
      `GRANT ALL PRIVILEGES ON ${scope} TO ${user}`,
      'FLUSH PRIVILEGES',
    ].join('; '),
  );
}

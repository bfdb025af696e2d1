import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createInterface } from 'node:readline';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

export interface AppProcess {
  url: string;
  owner: string;
  child: ChildProcess;
  /** SIGTERM and wait for the exit. */
  stop(): Promise<void>;
  /** SIGKILL: the process dies mid-work, as in a crash or power cut. */
  kill(): Promise<void>;
}

/** Starts the app in a child process with the given environment and waits until it listens. */
export async function spawnApp(env: Record<string, string>): Promise<AppProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'tests/support/app-process.ts'], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'test', PORT: '0', HOST: '127.0.0.1', ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const first = await new Promise<string>((resolve, reject) => {
    const lines = createInterface({ input: child.stdout! });
    lines.once('line', resolve);
    child.once('exit', (code) => reject(new Error(`app process exited with ${code} before listening`)));
  });
  const { url, owner } = JSON.parse(first) as { url: string; owner: string };
  return {
    url,
    owner,
    child,
    async stop() {
      child.kill('SIGTERM');
      await exited;
    },
    async kill() {
      child.kill('SIGKILL');
      await exited;
    },
  };
}

/** Environment for a child app process that shares an in-process test app's database and data folder. */
export function sharedEnvOf(config: { db: { host: string; port: number; name: string; user: string; password: string }; session: { secret: string }; dataDir: string }, extra: Record<string, string> = {}): Record<string, string> {
  return {
    DB_HOST: config.db.host, DB_PORT: String(config.db.port), DB_NAME: config.db.name, DB_USER: config.db.user, DB_PASSWORD: config.db.password,
    SESSION_SECRET: config.session.secret, DATA_DIR: config.dataDir, CLIENT_DIST: '/nonexistent', DEMO_SEED: 'off', IMPORT_POLL_MS: '100', ...extra,
  };
}

export interface EntryPointProcess {
  url: string;
  /** Everything the process wrote to stdout and stderr so far. */
  output(): string;
  /** SIGTERM, wait for the exit, and return the whole output. */
  stop(): Promise<string>;
}

/** Only what a process needs to find node and tsx; nothing else of the test runner's environment leaks in. */
const baseEnv = () => ({ PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '' });

/**
 * Starts the real entry point (`server/index.ts`, logging as `npm start` does, not quiet)
 * with exactly `env`, keeping every byte of stdout and stderr, and waits until it listens.
 */
export async function spawnEntryPoint(env: Record<string, string>, timeoutMs = 60_000): Promise<EntryPointProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: { ...baseEnv(), ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout!.on('data', (c: Buffer) => (output += c.toString('utf8')));
  child.stderr!.on('data', (c: Buffer) => (output += c.toString('utf8')));
  // 'close', not 'exit': the pipes are drained by then, so no last line is lost.
  const exited = new Promise<void>((resolve) => child.once('close', () => resolve()));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`app did not listen within ${timeoutMs} ms:\n${output}`)), timeoutMs);
    const lines = createInterface({ input: child.stdout! });
    lines.on('line', (line) => {
      const m = /Gaugeline is running at (http:\/\/\S+)/.exec(line);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`app exited with ${code} before listening:\n${output}`));
    });
  });
  return {
    url,
    output: () => output,
    async stop() {
      child.kill('SIGTERM');
      await exited;
      return output;
    },
  };
}

/** Runs the real entry point with exactly `env` until it exits (a start-up that should fail). */
export function runEntryPoint(env: Record<string, string>, timeoutMs = 30_000): Promise<{ code: number | null; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: { ...baseEnv(), ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout!.on('data', (c: Buffer) => (output += c.toString('utf8')));
    child.stderr!.on('data', (c: Buffer) => (output += c.toString('utf8')));
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutMs);
    child.once('close', (code) => {
      clearTimeout(timer);
      resolve({ code, output });
    });
  });
}

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

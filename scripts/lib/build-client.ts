import { existsSync, readdirSync, renameSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';
import { execFileSync } from 'node:child_process';

const SOURCES = ['client', 'shared', 'vite.config.ts', 'package-lock.json'];

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = 0;
  for (const entry of readdirSync(p)) {
    if (entry.startsWith('dist') || entry === 'node_modules') continue;
    newest = Math.max(newest, newestMtime(path.join(p, entry)));
  }
  return newest;
}

/** Builds the client when its sources are newer than the last build. */
export function buildClientIfStale(root: string): void {
  const built = path.join(root, 'client/dist/index.html');
  const builtAt = existsSync(built) ? statSync(built).mtimeMs : 0;
  const sourcesAt = Math.max(...SOURCES.map((s) => newestMtime(path.join(root, s))));
  if (builtAt >= sourcesAt) return;
  console.log('Building the client (vite build)...');
  // Another build of the same checkout (a second terminal) holds Vite's lock: wait for it.
  for (let attempt = 1; ; attempt++) {
    try {
      // Build beside the live folder and swap, so servers already running keep serving a whole client.
      const staging = path.join(root, `client/dist.building-${process.pid}`);
      execFileSync(process.execPath, [path.join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn', '--outDir', staging, '--emptyOutDir'], {
        cwd: root,
        stdio: ['ignore', 'inherit', 'pipe'],
      });
      const live = path.join(root, 'client/dist');
      const old = path.join(root, `client/dist.old-${process.pid}`);
      if (existsSync(live)) renameSync(live, old);
      renameSync(staging, live);
      rmSync(old, { recursive: true, force: true });
      return;
    } catch (err) {
      const stderr = String((err as { stderr?: Buffer }).stderr ?? '');
      if (!/another Vite build process/i.test(stderr) || attempt >= 24) {
        process.stderr.write(stderr);
        throw err;
      }
      Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 5000);
    }
  }
}

/**
 * Shared by the benchmarks: a throwaway MariaDB, the real app in a child process, RSS
 * sampling of another process, sign-in over HTTP, statistics and result files.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { freePort } from '../../lib/free-port.ts';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureDatabase, startMariaInstance, type MariaInstance } from '../../db/mariadb-instance.ts';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
/** Generated models and result files (git-ignored). */
export const BENCH_DIR = path.join(ROOT, '.data', 'bench');
export const DEMO_ENGINEER = { email: 'engineer@demo.gaugeline.test', password: 'gaugeline-demo' };

export interface ThrowawayDb {
  env: Record<string, string>;
  maria: MariaInstance;
  stop(): Promise<void>;
}

/** A private MariaDB on a free loopback port, in a temporary folder removed on stop. */
export async function startThrowawayDb(): Promise<ThrowawayDb> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-bench-db-'));
  const port = await freePort();
  const maria = await startMariaInstance({ dir, port, quiet: true });
  const password = randomBytes(12).toString('base64url');
  await ensureDatabase(maria, { name: 'gaugeline_bench', user: 'gaugeline_bench', password });
  return {
    maria,
    env: { DB_HOST: '127.0.0.1', DB_PORT: String(port), DB_NAME: 'gaugeline_bench', DB_USER: 'gaugeline_bench', DB_PASSWORD: password },
    async stop() {
      await maria.stop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

export interface AppProcess {
  url: string;
  child: ChildProcess;
  pid: number;
  dataDir: string;
  stop(): Promise<void>;
}

/**
 * The real app (startServer: migrations, demo seed, import worker pool) in a child process
 * of its own, so its memory can be measured apart from the benchmark's.
 */
export async function startAppProcess(dbEnv: Record<string, string>, extraEnv: Record<string, string> = {}, nodeArgs: string[] = []): Promise<AppProcess> {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-bench-data-'));
  const child = fork(path.join(ROOT, 'scripts/bench/lib/app-process.ts'), [], {
    execArgv: ['--import', 'tsx', ...nodeArgs],
    env: {
      ...process.env,
      // As scripts/start.sh runs the app (decision 0016).
      MALLOC_ARENA_MAX: process.env.MALLOC_ARENA_MAX ?? '2',
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: '0',
      SESSION_SECRET: randomBytes(24).toString('hex'),
      DATA_DIR: dataDir,
      CLIENT_DIST: path.join(ROOT, 'client/dist'),
      DEMO_SEED: 'on',
      SIGN_IN_LIMIT: '10000',
      IMPORT_POLL_MS: '100',
      // A 20,000-member import can pass the default 15 minutes when the machine is busy.
      IMPORT_TIME_LIMIT_SECONDS: '7200',
      ...dbEnv,
      ...extraEnv,
    },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    child.once('message', (m: { url?: string; error?: string }) => (m.url ? resolve(m.url) : reject(new Error(m.error ?? 'app did not start'))));
    child.once('exit', (code) => reject(new Error(`app process exited with ${code} before it was ready`)));
  });
  return {
    url,
    child,
    pid: child.pid!,
    dataDir,
    async stop() {
      const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
      child.send({ stop: true });
      await Promise.race([exited, sleep(20_000)]);
      if (child.exitCode === null) child.kill('SIGKILL');
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Resident set size of a process in bytes, from /proc (Linux). */
export function rssOf(pid: number): number {
  const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) * 1024 : 0;
}

/** CPU time (user + system, all threads) a process has used so far, in ms, from /proc/<pid>/stat. */
export function cpuMsOf(pid: number): number {
  const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  // Fields 14 and 15 of stat (utime, stime) in clock ticks of 1/100 s on Linux.
  return (Number(fields[11]) + Number(fields[12])) * 10;
}

/**
 * Waits until a process uses under 5 % of a core over half a second (at most `timeoutMs`);
 * returns how long that took, ms.
 */
export async function waitForIdleProcess(pid: number, timeoutMs = 15_000): Promise<number> {
  const t0 = performance.now();
  let last = cpuMsOf(pid);
  while (performance.now() - t0 < timeoutMs) {
    await sleep(500);
    const now = cpuMsOf(pid);
    if (now - last < 25) break;
    last = now;
  }
  return performance.now() - t0;
}

/** The kernel's own high-water mark of RSS (VmHWM), reset with resetPeakRss. */
export function peakRssOf(pid: number): number {
  const m = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  return m ? Number(m[1]) * 1024 : 0;
}

/** Resets VmHWM to the current RSS (Linux ≥ 4.0); false when not permitted. */
export function resetPeakRss(pid: number): boolean {
  try {
    writeFileSync(`/proc/${pid}/clear_refs`, '5');
    return true;
  } catch {
    return false;
  }
}

/** Samples a process's RSS every `everyMs` until stopped; returns the peak seen. */
export function sampleRss(pid: number, everyMs = 50): { stop(): { peak: number; samples: number } } {
  let peak = 0;
  let samples = 0;
  const take = () => {
    try {
      peak = Math.max(peak, rssOf(pid));
      samples++;
    } catch {
      // The process may have ended.
    }
  };
  take();
  const timer = setInterval(take, everyMs);
  return {
    stop() {
      clearInterval(timer);
      take();
      return { peak, samples };
    },
  };
}

/** A signed-in session over plain fetch: cookie and CSRF token. */
export interface Session {
  cookie: string;
  csrf: string;
}

function cookieOf(res: Response, previous = ''): string {
  const set = res.headers.getSetCookie?.() ?? [];
  const jar = new Map(previous.split('; ').filter(Boolean).map((c) => [c.split('=')[0], c] as const));
  for (const c of set) {
    const pair = c.split(';')[0];
    jar.set(pair.split('=')[0], pair);
  }
  return [...jar.values()].join('; ');
}

export async function signIn(url: string, who = DEMO_ENGINEER): Promise<Session> {
  const first = await fetch(`${url}/api/session`);
  let cookie = cookieOf(first);
  const { csrfToken } = (await first.json()) as { csrfToken: string };
  const res = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie },
    body: JSON.stringify({ email: who.email, password: who.password }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status} ${await res.text()}`);
  cookie = cookieOf(res, cookie);
  const body = (await res.json()) as { csrfToken: string };
  return { cookie, csrf: body.csrfToken };
}

export async function getJson<T>(url: string, s: Session): Promise<T> {
  const res = await fetch(url, { headers: { cookie: s.cookie } });
  if (!res.ok) throw new Error(`GET ${url}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

export async function firstProjectId(url: string, s: Session): Promise<number> {
  const { projects } = await getJson<{ projects: { id: number }[] }>(`${url}/api/projects`, s);
  return projects[0].id;
}

/** Uploads a file from disk as multipart `file` (streamed from disk, not read into memory). */
/**
 * Uploads a file as the browser would (multipart: model name, then the file), streamed from
 * disk over plain node:http. fetch with a FormData Blob sent 154 MB at about 110 MB/s, the
 * client's own encoding being the limit; this client is not what the benchmark measures.
 */
export async function uploadFile(url: string, s: Session, projectId: number, filePath: string, modelName: string): Promise<{ revisionId: number; status: number }> {
  const http = await import('node:http');
  const { createReadStream, statSync } = await import('node:fs');
  const boundary = `----gaugeline-bench-${randomBytes(12).toString('hex')}`;
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="modelName"\r\n\r\n${modelName}\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${path.basename(filePath)}"\r\nContent-Type: application/octet-stream\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const length = head.length + statSync(filePath).size + tail.length;
  const { status, text } = await new Promise<{ status: number; text: string }>((resolve, reject) => {
    const req = http.request(`${url}/api/projects/${projectId}/uploads`, {
      method: 'POST',
      headers: { cookie: s.cookie, 'x-csrf-token': s.csrf, 'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': length },
    }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.write(head);
    const file = createReadStream(filePath, { highWaterMark: 1024 * 1024 });
    file.on('error', reject);
    file.on('end', () => req.end(tail));
    file.pipe(req, { end: false });
  });
  const body = JSON.parse(text) as { revision?: { id: number }; message?: string };
  if (status !== 201 && status !== 200) throw new Error(`upload failed: ${status} ${text}`);
  return { revisionId: body.revision!.id, status };
}

export interface RevisionState {
  status: string;
  progress: number;
  failure?: { error: string; message: string } | null;
  summary?: { candidates: number; timings?: Record<string, number>; geometry?: 'pending' | 'ready' | 'failed' } | null;
}

/** Polls a revision every `everyMs` until it is done or failed. */
export async function waitForRevision(
  url: string, s: Session, projectId: number, revisionId: number, everyMs = 50, onChange?: (status: string, progress: number) => void, timeoutMs = 30 * 60_000,
): Promise<RevisionState> {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  for (;;) {
    const r = await getJson<RevisionState>(`${url}/api/projects/${projectId}/revisions/${revisionId}`, s);
    const key = `${r.status} ${r.progress}`;
    if (key !== last) onChange?.(r.status, r.progress);
    last = key;
    if (r.status === 'done' || r.status === 'failed') return r;
    if (Date.now() > deadline) throw new Error(`revision ${revisionId} still ${r.status} after ${timeoutMs} ms`);
    await sleep(everyMs);
  }
}

/** Polls until the revision's 3D geometry (built after the results are stored) is no longer pending; ms waited, or null when not tracked. */
export async function waitForGeometry(url: string, s: Session, projectId: number, revisionId: number, timeoutMs = 20 * 60_000): Promise<{ ms: number; state: string } | null> {
  const t0 = performance.now();
  for (;;) {
    const r = await getJson<RevisionState>(`${url}/api/projects/${projectId}/revisions/${revisionId}`, s);
    const g = r.summary?.geometry;
    if (g === undefined) return null;
    if (g !== 'pending' || performance.now() - t0 > timeoutMs) return { ms: performance.now() - t0, state: g };
    await sleep(250);
  }
}

// ---- statistics and formatting

export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

export interface Spread {
  median: number;
  min: number;
  max: number;
  n: number;
}

export function spread(xs: number[]): Spread {
  return { median: median(xs), min: Math.min(...xs), max: Math.max(...xs), n: xs.length };
}

export const MB = 1024 * 1024;
export const fmtMs = (ms: number) => (ms >= 10_000 ? `${(ms / 1000).toFixed(1)} s` : ms >= 1000 ? `${(ms / 1000).toFixed(2)} s` : `${Math.round(ms)} ms`);
export const fmtMb = (b: number) => `${(b / MB).toFixed(b >= 100 * MB ? 0 : 1)} MB`;
export const fmtSpread = (s: Spread, f: (v: number) => string) => (s.n > 1 ? `${f(s.median)} (${f(s.min)}–${f(s.max)})` : f(s.median));

/** Prints a plain aligned table. */
export function table(header: string[], rows: string[][]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i])).join(' | ');
  return [line(header), widths.map((w) => '-'.repeat(w)).join('-|-'), ...rows.map(line)].join('\n');
}

/** Writes a bench's results for run-all to put into docs/benchmarks.md. */
export function writeResults(name: string, data: unknown): string {
  mkdirSync(BENCH_DIR, { recursive: true });
  const file = path.join(BENCH_DIR, `results-${name}.json`);
  writeFileSync(file, JSON.stringify(data, null, 2));
  return file;
}

export function readResults<T>(name: string): T | null {
  try {
    return JSON.parse(readFileSync(path.join(BENCH_DIR, `results-${name}.json`), 'utf8')) as T;
  } catch {
    return null;
  }
}

/**
 * CPU per thread of a process while it runs (sampled every `everyMs` from /proc/<pid>/task,
 * so threads that start and end in between are caught): ms per thread on stop, keyed by its
 * name (comm), "main" or its tid, and "new" for threads started after sampling began. Node
 * leaves most of its threads named "node", so the tid tells them apart.
 */
export function sampleThreadCpu(pid: number, everyMs = 100): { stop(): Record<string, number> } {
  const read = (into: Map<string, { name: string; ms: number }>) => {
    let tids: string[] = [];
    try {
      tids = readdirSync(`/proc/${pid}/task`);
    } catch {
      return;
    }
    for (const tid of tids) {
      try {
        const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, 'utf8');
        const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
        into.set(tid, { name: stat.slice(stat.indexOf('(') + 1, stat.lastIndexOf(')')), ms: (Number(f[11]) + Number(f[12])) * 10 });
      } catch {
        // the thread ended between the listing and the read
      }
    }
  };
  const base = new Map<string, { name: string; ms: number }>();
  read(base);
  const last = new Map<string, { name: string; ms: number }>();
  const timer = setInterval(() => read(last), everyMs);
  return {
    stop() {
      clearInterval(timer);
      read(last);
      const byThread: Record<string, number> = {};
      for (const [tid, { name, ms }] of last) byThread[tid === String(pid) ? `${name} main` : `${name} ${base.has(tid) ? '' : 'new '}#${tid}`] = ms - (base.get(tid)?.ms ?? 0);
      return byThread;
    },
  };
}

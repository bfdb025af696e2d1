/**
 * Member table and member sheet under load: a 20,000-member revision imported once into the
 * real app (child process, throwaway MariaDB), then 50 signed-in clients on loopback, each
 * alternating table, table, sheet requests (random sort keys, directions, band filters,
 * minimum utilisation, searches and pages; random members), bounded by time and count.
 * Load tool: autocannon. Run: npm run bench:api [-- --members=20000] [-- --seconds=20]
 * [-- --requests=20000] [-- --connections=50] [-- --via=api] (import through the upload API,
 * display geometry included, instead of the quicker in-process read, check and store)
 * [-- --profile=DIR] (V8 CPU profile of the app process, written when it stops).
 */
import { readFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon, { type Client } from 'autocannon';
import {
  ROOT, cpuMsOf, firstProjectId, fmtMs, getJson, rssOf, signIn, startAppProcess, startThrowawayDb, table, uploadFile, waitForRevision, writeResults,
  type Session,
} from './lib/bench-support.ts';
import { ensureModels, seedRevision } from './import.ts';

const arg = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);

const SORT_KEYS = ['utilisation', 'globalId', 'tag', 'name', 'ifcClass', 'profile', 'grade', 'designForceN', 'designCapacityN', 'governing', 'warningCount'];
const BANDS = ['spare', 'working', 'tight', 'over', 'unknown'];

// Deterministic choices (mulberry32) so runs ask the same mix.
function rng(seed: number) {
  return () => {
    seed = (seed + 0x6d2b79f5) | 0;
    let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface EndpointStats {
  endpoint: string;
  requests: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  non2xx: number;
  meanBytes: number;
}

export interface ApiResults {
  date: string;
  members: number;
  fileBytes: number;
  importMs: number;
  connections: number;
  seconds: number;
  durationS: number;
  requestLimit: number;
  mix: string;
  via: string;
  endpoints: EndpointStats[];
  overall: EndpointStats;
  /** The first table page after the import, while the app loads its copy of the table. */
  coldFirstMs?: number;
  /** One request per sort key and direction after it, before the timed run. */
  warmUpMs?: number;
  errors: number;
  timeouts: number;
  appRssPeak: number;
  /** CPU time per answered request during the timed run (user + system, all threads), in ms: the steadier number on a shared machine. */
  cpuMsPerRequest?: { app: number; database: number; loadTool: number };
  loadAverage: { start: number[]; end: number[] };
  samples: Record<string, number>;
}

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

function stats(endpoint: string, times: number[], bytes: number[], non2xx: number, seconds: number): EndpointStats {
  const s = [...times].sort((a, b) => a - b);
  return {
    endpoint, requests: s.length, perSecond: s.length / seconds, p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99), max: s.at(-1) ?? NaN,
    non2xx, meanBytes: bytes.length ? bytes.reduce((a, b) => a + b, 0) / bytes.length : 0,
  };
}

async function main(): Promise<void> {
  const members = Number(arg('members') ?? 20_000);
  const seconds = Number(arg('seconds') ?? 20);
  const requestLimit = Number(arg('requests') ?? 20_000);
  const connections = Number(arg('connections') ?? 50);
  // The table and sheet do not depend on how the revision got there; the quick way skips meshing.
  const via = arg('via') ?? 'direct';
  const loadStart = os.loadavg();
  const { file } = (await ensureModels([members])).get(members)!;

  const db = await startThrowawayDb();
  try {
    // --profile=DIR writes a V8 CPU profile of the app process there when it stops.
    const profileDir = arg('profile');
    // --app-node-args="--a --b" adds Node options to the app process (tuning experiments).
    const nodeArgs = [...(arg('app-node-args')?.split(' ').filter(Boolean) ?? []), ...(profileDir ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(profileDir)}`] : [])];
    const app = await startAppProcess(db.env, { IMPORT_WORKERS: '1', UPLOAD_LIMIT_MB: '2000', SIGN_IN_LIMIT: '10000' }, nodeArgs);
    try {
      const engineer = await signIn(app.url);
      const projectId = await firstProjectId(app.url, engineer);
      const t0 = performance.now();
      let revisionId: number;
      if (via === 'api') {
        const up = await uploadFile(app.url, engineer, projectId, file, `api bench ${members}`);
        const state = await waitForRevision(app.url, engineer, projectId, up.revisionId, 250);
        if (state.status !== 'done') throw new Error(`import failed: ${state.failure?.error}: ${state.failure?.message}`);
        revisionId = up.revisionId;
      } else {
        revisionId = (await seedRevision(file, projectId, db.env)).revisionId;
      }
      const importMs = performance.now() - t0;
      console.log(`imported ${members} members in ${fmtMs(importMs)} (revision ${revisionId}, ${via === 'api' ? 'through the upload API' : 'read, extract, check and storeOutcome in a child process, no display geometry'})`);
      const base = `/api/projects/${projectId}/revisions/${revisionId}`;

      // Real GlobalIds and search terms to ask for. This is the first table request after the import.
      const coldStarted = performance.now();
      const page = await getJson<{ total: number; members: { globalId: string; name: string | null; profile: string | null }[] }>(`${app.url}${base}/members?scope=all&pageSize=500&sort=globalId`, engineer);
      const coldFirstMs = performance.now() - coldStarted;
      const gids = page.members.map((m) => m.globalId);
      const total = page.total;
      const searches = ['brace 1', 'Synthetic', page.members[7]?.globalId.slice(0, 6) ?? 'x', page.members[0]?.profile ?? 'FL', 'zzz-no-match', '12'];
      console.log(`${total} members in the tension scope; sheets asked for ${gids.length} distinct members`);

      // 50 sessions (sign-in is slow on purpose: password hashing); one per connection.
      const sessions: Session[] = [];
      for (let i = 0; i < connections; i++) sessions.push(await signIn(app.url));

      const rand = rng(7);
      const pick = <T>(xs: T[]) => xs[Math.floor(rand() * xs.length)];
      const samples: Record<string, number> = {};
      const tableQuery = (): string => {
        const q = new URLSearchParams();
        const pageSize = pick([25, 50, 100]);
        q.set('pageSize', String(pageSize));
        q.set('sort', pick(SORT_KEYS));
        q.set('dir', pick(['asc', 'desc']));
        const kind = rand();
        let label = 'sorted';
        if (kind < 0.25) {
          q.set('band', pick([BANDS.slice(0, 2), ['tight', 'over'], [pick(BANDS)]]).join(','));
          label = 'band filter';
        } else if (kind < 0.4) {
          q.set('minUtilisation', pick(['0.5', '0.8', '1']));
          label = 'min utilisation';
        } else if (kind < 0.6) {
          q.set('q', pick(searches));
          label = 'search';
        } else if (kind < 0.7) {
          q.set('scope', 'all');
          label = 'all candidates';
        }
        // Mostly early pages, sometimes deep ones.
        const pages = Math.max(1, Math.ceil(total / pageSize));
        q.set('page', String(rand() < 0.8 ? 1 + Math.floor(rand() * Math.min(5, pages)) : 1 + Math.floor(rand() * pages)));
        samples[label] = (samples[label] ?? 0) + 1;
        return `${base}/members?${q}`;
      };

      // The first page after an import (the app loads its copy of the table) is timed on its own,
      // then one request per sort key and direction warms the orders; neither is in the timed run.
      const warmStarted = performance.now();
      for (const sort of SORT_KEYS) for (const dir of ['asc', 'desc']) await getJson(`${app.url}${base}/members?pageSize=25&sort=${sort}&dir=${dir}`, sessions[0]);
      const warmUpMs = performance.now() - warmStarted;
      console.log(`first table page (cold copy): ${fmtMs(coldFirstMs)}; warm-up of ${SORT_KEYS.length * 2} orders: ${fmtMs(warmUpMs)}`);
      const kinds = ['member table', 'member table', 'member sheet'] as const;
      const perClient = new Map<Client, number>();
      const times: Record<string, number[]> = { 'member table': [], 'member sheet': [] };
      const bytes: Record<string, number[]> = { 'member table': [], 'member sheet': [] };
      const non2xx: Record<string, number> = { 'member table': 0, 'member sheet': 0 };
      let nextSession = 0;
      let rssPeak = rssOf(app.pid);
      const rssTimer = setInterval(() => (rssPeak = Math.max(rssPeak, rssOf(app.pid))), 200);

      const dbPid = Number(readFileSync(path.join(db.maria.dir, 'mysqld.pid'), 'utf8').trim());
      const cpuBefore = { app: cpuMsOf(app.pid), database: cpuMsOf(dbPid), loadTool: process.cpuUsage() };
      const started = performance.now();
      const instance = autocannon({
        url: app.url,
        connections,
        pipelining: 1,
        duration: seconds,
        // @ts-expect-error maxOverallRequests bounds the count alongside duration
        maxOverallRequests: requestLimit,
        timeout: 30,
        setupClient: (client) => {
          const s = sessions[nextSession++ % sessions.length];
          client.setHeaders({ cookie: s.cookie, accept: 'application/json' });
        },
        requests: [
          { method: 'GET', setupRequest: (req) => ({ ...req, path: tableQuery() }) },
          { method: 'GET', setupRequest: (req) => ({ ...req, path: tableQuery() }) },
          { method: 'GET', setupRequest: (req) => ({ ...req, path: `${base}/members/${pick(gids)}` }) },
        ],
      });
      instance.on('response', (client: Client, status: number, resBytes: number, responseTime: number) => {
        const n = perClient.get(client) ?? 0;
        perClient.set(client, n + 1);
        const kind = kinds[n % kinds.length];
        times[kind].push(responseTime);
        bytes[kind].push(resBytes);
        if (status < 200 || status >= 300) non2xx[kind]++;
      });
      const result = await instance;
      const durationS = (performance.now() - started) / 1000;
      clearInterval(rssTimer);
      const answered = Object.values(times).reduce((n, t) => n + t.length, 0);
      const toolCpu = process.cpuUsage(cpuBefore.loadTool);
      const cpuMsPerRequest = {
        app: (cpuMsOf(app.pid) - cpuBefore.app) / answered,
        database: (cpuMsOf(dbPid) - cpuBefore.database) / answered,
        loadTool: (toolCpu.user + toolCpu.system) / 1000 / answered,
      };

      const endpoints = Object.keys(times).map((k) => stats(k, times[k], bytes[k], non2xx[k], durationS));
      const overall = stats('all', [...times['member table'], ...times['member sheet']], [...bytes['member table'], ...bytes['member sheet']], non2xx['member table'] + non2xx['member sheet'], durationS);
      const results: ApiResults = {
        date: new Date().toISOString(), members, fileBytes: (await import('node:fs')).statSync(file).size, importMs, connections, seconds, durationS, requestLimit,
        mix: 'each connection repeats: member table, member table, member sheet', via,
        coldFirstMs, warmUpMs, endpoints, overall, errors: result.errors, timeouts: result.timeouts, appRssPeak: rssPeak, cpuMsPerRequest, loadAverage: { start: loadStart, end: os.loadavg() }, samples,
      };
      console.log(`\n${connections} connections, ${durationS.toFixed(1)} s, ${overall.requests} requests (limit ${requestLimit} or ${seconds} s), errors ${result.errors}, timeouts ${result.timeouts}; table query mix: ${JSON.stringify(samples)}\n`);
      console.log(apiTable(results));
      console.log(`\nCPU per request: app ${cpuMsPerRequest.app.toFixed(2)} ms, MariaDB ${cpuMsPerRequest.database.toFixed(2)} ms, load tool ${cpuMsPerRequest.loadTool.toFixed(2)} ms`);
      // Let requests still queued in the app finish before it is stopped.
      await new Promise((r) => setTimeout(r, 3000));
      console.log(`\nautocannon's own latency (all requests): p50 ${result.latency.p50} ms, p97.5 ${result.latency.p97_5} ms, p99 ${result.latency.p99} ms; app RSS peak ${(rssPeak / 1048576).toFixed(0)} MB`);
      console.log(`results: ${path.relative(ROOT, writeResults('api', results))}`);
    } finally {
      await app.stop();
    }
  } finally {
    await db.stop();
  }
}

const ms = (v: number) => (Number.isFinite(v) ? `${Math.round(v)} ms` : '—');

export function apiTable(r: ApiResults): string {
  return table(
    ['endpoint', 'requests', 'req/s', 'p50', 'p95', 'p99', 'max', 'non-2xx', 'mean body', 'p95 target < 100 ms'],
    [...r.endpoints, r.overall].map((e) => [
      e.endpoint, String(e.requests), e.perSecond.toFixed(0), ms(e.p50), ms(e.p95), ms(e.p99), ms(e.max), String(e.non2xx), `${(e.meanBytes / 1024).toFixed(1)} KB`,
      e.p95 < 100 ? '✓' : '✗',
    ]),
  );
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  main().then(
    () => process.exit(0),
    (err) => {
      console.error(err instanceof Error ? err.stack : err);
      process.exit(1);
    },
  );
}

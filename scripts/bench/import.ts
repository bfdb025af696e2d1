/**
 * Import speed and memory against web-ifc's bare floor, for synthetic models of 1,000, 5,000
 * and 20,000 members (the 20,000-member file is over 100 MB; --big adds 50,000 members,
 * about 380 MB). Run: npm run bench:import [-- --big] [-- --sizes=1000,5000] [-- --repeat=N]
 * [-- --profile] (CPU profiles of the in-process runs into .data/bench/profiles/)
 * [-- --app-profile=DIR] (CPU profiles of the app process in the whole imports) [-- --quick] (whole imports only: no wait for the 3D geometry after the last, no in-process runs; results not written).
 *
 * Every measurement runs in a fresh child process, so the numbers do not include this
 * script's own memory. Generated models are cached in .data/bench/ keyed by the generator's
 * source, so only the first run pays for generation.
 */
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, renameSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { serialize } from 'node:v8';
import {
  BENCH_DIR, ROOT, cpuMsOf, firstProjectId, median, fmtMb, fmtMs, fmtSpread, peakRssOf, resetPeakRss, rssOf, sampleRss, sampleThreadCpu,
  signIn, spread, startAppProcess, waitForIdleProcess, startThrowawayDb, table, uploadFile, waitForGeometry, waitForRevision, writeResults, type Spread,
} from './lib/bench-support.ts';

const SELF = fileURLToPath(import.meta.url);
const arg = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.slice(name.length + 3);
const flag = (name: string) => process.argv.includes(`--${name}`);

export const BARE_DEFINITION =
  'bare = in a fresh process with the wasm already initialised and the file already in memory: web-ifc OpenModel, ' +
  'then GetLineIDsWithType for IfcMember, IfcBeam, IfcColumn, IfcPlate (with subtypes), IfcMechanicalFastener and IfcFastener, ' +
  'then GetLine (not flattened, no inverse attributes) of every id listed. It is the least any import must do. ' +
  'One bare read runs right before each whole import, while the app is idle, and whole / bare is the median of those pairs: ' +
  'this machine\'s speed drifts within minutes, and a pair sees the same machine.';
export const WHOLE_DEFINITION =
  'whole = through the API of the real app (child process, throwaway MariaDB): from the start of the multipart upload ' +
  '(streamed from disk over loopback) until GET /revisions/:id says done — upload, hashing, file store, job claim, ' +
  'worker thread (read, extract, check), checked members handed to the main thread in slices of 1,000 and stored as they come — members, forces and results in one transaction. ' +
  'Memory: peak RSS of the app process (all threads) sampled every 50 ms; "added by the import" is that peak less the idle app ' +
  '(RSS once the warm-up import of the 26-member sample and its 3D geometry are done and the app is idle, taken once), the memory the import itself needs, which the 8 × target is held to.';

// ---------------------------------------------------------------- child modes

async function childGenerate(n: number, out: string): Promise<void> {
  const { makeSyntheticModel } = await import('../samples/make-samples.ts');
  const t0 = performance.now();
  const bytes = await makeSyntheticModel(n);
  const ms = performance.now() - t0;
  writeFileSync(`${out}.part`, bytes);
  renameSync(`${out}.part`, out);
  report({ ms, bytes: bytes.length });
}

async function childBare(file: string): Promise<void> {
  const W = await import('web-ifc');
  const bytes = new Uint8Array(readFileSync(file));
  const api = new W.IfcAPI();
  await api.Init(undefined, true); // as the app does: single-threaded wasm
  api.SetLogLevel(W.LogLevel.LOG_LEVEL_OFF);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const modelID = api.OpenModel(bytes, { COORDINATE_TO_ORIGIN: false });
  const t1 = performance.now();
  let lines = 0;
  for (const type of [W.IFCMEMBER, W.IFCBEAM, W.IFCCOLUMN, W.IFCPLATE, W.IFCMECHANICALFASTENER, W.IFCFASTENER]) {
    const ids = api.GetLineIDsWithType(modelID, type, true);
    for (let i = 0; i < ids.size(); i++) {
      if (api.GetLine(modelID, ids.get(i))) lines++;
    }
  }
  const t2 = performance.now();
  const cpu = process.cpuUsage(cpu0);
  api.CloseModel(modelID);
  report({ openMs: t1 - t0, listMs: t2 - t1, totalMs: t2 - t0, cpuMs: (cpu.user + cpu.system) / 1000, lines, peakRss: peakRssOf(process.pid) });
}

/**
 * The database side of the child modes: a connection from the environment and a new model with
 * one revision claimed by `owner`, in the given project (or the first one), ready for storeOutcome.
 */
async function benchRevision(file: string, owner: string, projectId?: number) {
  const { loadConfig } = await import('../../server/config/config.ts');
  const { createDatabase } = await import('../../server/db/database.ts');
  const { ProjectModel } = await import('../../server/db/models/project.ts');
  const { IfcModelModel } = await import('../../server/db/models/ifc-model.ts');
  const { RevisionModel } = await import('../../server/db/models/revision.ts');
  const sequelize = createDatabase(loadConfig(process.env).db);
  const project = projectId ? await ProjectModel.findByPk(projectId) : await ProjectModel.findOne({ order: [['id', 'ASC']] });
  if (!project) throw new Error(`no project ${projectId ?? ''} in the benchmark database`);
  const model = await IfcModelModel.create({ projectId: project.id, name: `${owner} ${path.basename(file)} ${Date.now()}` });
  const revision = await RevisionModel.create({
    modelId: model.id, number: 1, fileName: path.basename(file), fileSize: statSync(file).size, sha256: 'bench', storageKey: 'bench',
    uploadedById: null, standard: project.standard, status: 'checking', claimedBy: owner,
  });
  return { sequelize, project, revision };
}

/**
 * The import task (runImportTask, the worker's code) in this process's main thread, then the
 * hand-over clone and storeOutcome into the DB from the environment; heap sampled every 50 ms.
 */
async function childDirect(file: string): Promise<void> {
  const { runImportTask } = await import('../../server/imports/run-import-task.ts');
  const { getIfcApi } = await import('../../server/ifc/ifc-api.ts');
  const { storeOutcome } = await import('../../server/imports/store-outcome.ts');
  const { StorableSlices } = await import('../../server/imports/member-slices.ts');

  const { sequelize, project, revision } = await benchRevision(file, 'bench-direct');
  await getIfcApi(); // wasm init is paid once per worker, not per import

  let heapPeak = 0;
  let externalPeak = 0;
  let rssPeak = 0;
  const take = () => {
    const m = process.memoryUsage();
    heapPeak = Math.max(heapPeak, m.heapUsed);
    externalPeak = Math.max(externalPeak, m.external);
    rssPeak = Math.max(rssPeak, m.rss);
  };
  const timer = setInterval(take, 50);
  const rssBefore = process.memoryUsage().rss;
  const t0 = performance.now();
  const outcome = await runImportTask({ filePath: file, kind: 'ifc', standard: 'as4100', defaultGrade: project.defaultGrade, inflateLimitBytes: 1e12 });
  const taskMs = performance.now() - t0;
  take();
  if (!outcome.ok) throw new Error(`import failed: ${outcome.failure.message}`);
  let t = performance.now();
  // The worker serialises each member's detail and its capacity's text once (member-slices.ts) and
  // hands them over in slices as structured clones; v8.serialize is the same format. Both are
  // counted here, in one piece; storeOutcome serialises again on its way to the store.
  const storable = new StorableSlices().of(outcome.members);
  const cloneBytes = serialize({ ...outcome, members: storable }).length;
  const cloneMs = performance.now() - t;
  t = performance.now();
  const kept = await storeOutcome(sequelize, revision.id, 'bench-direct', 'as4100', outcome.summary, outcome.members);
  const storeMs = performance.now() - t;
  clearInterval(timer);
  take();
  if (!kept) throw new Error('storeOutcome did not keep the result');
  const members = outcome.members;
  const detailBytes = members.reduce((n, m) => n + JSON.stringify(m.detail).length, 0);
  const resultBytes = members.reduce((n, m) => n + (m.result ? JSON.stringify(m.result).length : 0), 0);
  const geometry = (outcome as { geometry?: Uint8Array | null }).geometry;
  await sequelize.close();
  report({
    ms: { ...(outcome.summary.timings ?? {}), task: taskMs, clone: cloneMs, store: storeMs },
    members: members.length, heapPeak, externalPeak, rssPeak, rssBefore, cloneBytes, detailBytes, resultBytes,
    geometryBytes: geometry?.length ?? null, vmHwm: peakRssOf(process.pid),
  });
}

/**
 * Seeds a revision for the API benchmark: read, extract, check and store (storeOutcome) in this
 * process, without display geometry, into a given project of the DB from the environment.
 */
async function childSeed(file: string, projectId: number): Promise<void> {
  const { readUploadBytes } = await import('../../server/imports/read-upload-bytes.ts');
  const { readIfcModel } = await import('../../server/ifc/read-model.ts');
  const { checkModel } = await import('../../server/imports/check-members.ts');
  const { addToTally, emptyTally, summarise } = await import('../../server/imports/summarise.ts');
  const { storeOutcome } = await import('../../server/imports/store-outcome.ts');
  const { sequelize, project, revision } = await benchRevision(file, 'bench-seed', projectId);
  const t0 = performance.now();
  const extracted = await readIfcModel(await readUploadBytes(file, 'ifc', 1e12));
  const members = checkModel(extracted, { standard: project.standard, defaultGrade: project.defaultGrade });
  const kept = await storeOutcome(sequelize, revision.id, 'bench-seed', project.standard, summarise(extracted, addToTally(emptyTally(), members), {}), members);
  if (!kept) throw new Error('storeOutcome did not keep the result');
  await sequelize.close();
  report({ revisionId: revision.id, ms: performance.now() - t0 });
}

/** Runs the seed step in a child process (see childSeed). */
export function seedRevision(file: string, projectId: number, dbEnv: Record<string, string>): Promise<{ revisionId: number; ms: number }> {
  return runChild('seed', [`--file=${file}`, `--project=${projectId}`], dbEnv, ['--max-old-space-size=4096']);
}

function report(data: unknown): void {
  process.stdout.write(`RESULT ${JSON.stringify(data)}\n`);
}

// ---------------------------------------------------------------- parent side

/** Runs this file in a child mode; returns its RESULT line. */
function runChild<T>(mode: string, args: string[], env: Record<string, string> = {}, nodeArgs: string[] = []): Promise<T> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', SELF, `--child=${mode}`, ...args], {
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'inherit'],
      cwd: ROOT,
    });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.on('exit', (code) => {
      const line = out.split('\n').find((l) => l.startsWith('RESULT '));
      if (code === 0 && line) resolve(JSON.parse(line.slice(7)) as T);
      else reject(new Error(`child ${mode} exited with ${code}: ${out.slice(-2000)}`));
    });
  });
}

function generatorHash(): string {
  const h = createHash('sha256');
  const dir = path.join(ROOT, 'scripts/samples');
  for (const f of readdirSync(dir).filter((f) => f.endsWith('.ts')).sort()) h.update(f).update(readFileSync(path.join(dir, f)));
  h.update(JSON.parse(readFileSync(path.join(ROOT, 'node_modules/web-ifc/package.json'), 'utf8')).version);
  return h.digest('hex').slice(0, 10);
}

/** Synthetic models of the given sizes, generated once (in a child process) and cached in .data/bench/. */
export async function ensureModels(sizes: number[]): Promise<Map<number, { file: string; gen: ImportRow['generation'] }>> {
  mkdirSync(BENCH_DIR, { recursive: true });
  const hash = generatorHash();
  const files = new Map<number, { file: string; gen: ImportRow['generation'] }>();
  for (const n of sizes) {
    const file = path.join(BENCH_DIR, `synthetic-${n}-${hash}.ifc`);
    if (existsSync(file)) {
      files.set(n, { file, gen: { ms: null, cached: true } });
      console.log(`model ${n} members: cached ${path.relative(ROOT, file)} (${fmtMb(statSync(file).size)})`);
    } else {
      const g = await runChild<{ ms: number; bytes: number }>('generate', [`--n=${n}`, `--out=${file}`], {}, ['--max-old-space-size=12000']);
      files.set(n, { file, gen: { ms: g.ms, cached: false } });
      console.log(`model ${n} members: generated in ${fmtMs(g.ms)} (${fmtMb(g.bytes)}) — generation is not part of any number below`);
    }
  }
  return files;
}

export interface ImportRow {
  members: number;
  fileBytes: number;
  generation: { ms: number | null; cached: boolean };
  bare: { total: Spread; cpu: Spread; open: Spread; list: Spread; lines: number };
  whole: { ms: Spread; cpu: Spread; runs: number[]; worker: { readAndExtractMs: Spread; checkMs: Spread; geometryMs: Spread }; geometryAfterMs?: Spread | null; peakRss: Spread; peakRssHwm: Spread; rssBefore: Spread; idleApp?: number };
  /** whole / bare of each whole import and the bare read just before it. */
  pairRatios?: number[];
  ratio: { wholeOverBare: number; cpuOverBareCpu: number; peakRssOverFile: number; addedOverFile?: number };
  direct?: { ms: Record<string, number>; heapPeak: number; externalPeak: number; rssPeak: number; rssBefore: number; cloneBytes: number; detailBytes: number; resultBytes: number; geometryBytes: number | null };
}

async function main(): Promise<void> {
  const sizes = (arg('sizes') ?? '1000,5000,20000').split(',').map(Number).filter((n) => n > 0);
  if (flag('big') && !sizes.includes(50_000)) sizes.push(50_000);
  // Three whole imports per size (an import of 20,000 members takes seconds now, and one run on
  // this machine's two shared cores says little); 50,000 members (--big) once unless asked.
  const repeatFor = (n: number) => Number(arg('repeat') ?? (n >= 50_000 ? 1 : 3));
  const profile = flag('profile');
  mkdirSync(BENCH_DIR, { recursive: true });
  const loadStart = os.loadavg();
  console.log(`Import benchmark — ${os.cpus().length} cores, ${(os.totalmem() / 1024 ** 3).toFixed(0)} GiB, node ${process.version}; sizes ${sizes.join(', ')}; whole imports per size ${sizes.map(repeatFor).join('/')}, each after a bare read of its own.`);

  // 1. Models (cached).
  const files = await ensureModels(sizes);

  // 2. Whole imports through the real app, each after a bare read (the floor) of the same file.
  type BareRun = { openMs: number; listMs: number; totalMs: number; cpuMs: number; lines: number };
  const db = await startThrowawayDb();
  const dbPid = Number(readFileSync(path.join(db.maria.dir, 'mysqld.pid'), 'utf8').trim());
  const rows: ImportRow[] = [];
  try {
    // --app-profile=DIR: V8 CPU profiles of the app process and its threads, written when it stops.
    const appProfile = arg('app-profile');
    // --app-node-args="--a --b" adds Node/V8 options to the app process (tuning experiments).
    const nodeArgs = [...(arg('app-node-args')?.split(' ').filter(Boolean) ?? []), ...(appProfile ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(appProfile)}`] : [])];
    const app = await startAppProcess(db.env, { IMPORT_WORKERS: '1', UPLOAD_LIMIT_MB: '2000' }, nodeArgs);
    try {
      const session = await signIn(app.url);
      const projectId = await firstProjectId(app.url, session);
      // A cold worker (thread start, TypeScript loader, wasm init) is paid once per idle pool; measure it apart.
      const coldStart = performance.now();
      const warm = await uploadFile(app.url, session, projectId, path.join(ROOT, 'samples/kestrel-yard-shed.ifc'), 'bench warm-up');
      await waitForRevision(app.url, session, projectId, warm.revisionId);
      console.log(`warm-up import of the 26-member sample (cold worker): ${fmtMs(performance.now() - coldStart)}`);
      // The idle app with a warm worker: what every import's memory is counted from (see WHOLE_DEFINITION).
      // Measured once the warm-up's 3D geometry and its aftermath are done: read while that task ran,
      // the "idle" app was larger than a small import's peak and the memory added came out below zero.
      await waitForGeometry(app.url, session, projectId, warm.revisionId);
      await waitForIdleProcess(app.pid);
      const idleApp = rssOf(app.pid);

      for (const n of sizes) {
        const { file } = files.get(n)!;
        const fileBytes = statSync(file).size;
        const runs: { ms: number; cpu: number; rex: number; check: number; geometry: number; geometryAfter?: number; peak: number; hwm: number; before: number }[] = [];
        const bareRuns: BareRun[] = [];
        for (let i = 0; i < repeatFor(n); i++) {
          await waitForIdleProcess(app.pid);
          const br = await runChild<BareRun>('bare', [`--file=${file}`]);
          bareRuns.push(br);
          console.log(`bare ${n} #${i + 1}: ${fmtMs(br.totalMs)} (CPU ${fmtMs(br.cpuMs)}; open ${fmtMs(br.openMs)}, list ${br.lines} lines ${fmtMs(br.listMs)})`);
          const before = rssOf(app.pid);
          const hwmOk = resetPeakRss(app.pid);
          const sampler = sampleRss(app.pid, 50);
          const cpu0 = cpuMsOf(app.pid);
          const threads = sampleThreadCpu(app.pid);
          const dbCpu0 = cpuMsOf(dbPid);
          const t0 = performance.now();
          const up = await uploadFile(app.url, session, projectId, file, `bench ${n} #${i + 1} ${Date.now()}`);
          const timeline: string[] = [`uploaded ${fmtMs(performance.now() - t0)}`];
          const state = await waitForRevision(app.url, session, projectId, up.revisionId, 50, (st, p) => timeline.push(`${st} ${Math.round(p * 100)}% @${fmtMs(performance.now() - t0)} ${fmtMb(rssOf(app.pid))}`));
          const ms = performance.now() - t0;
          const cpu = cpuMsOf(app.pid) - cpu0;
          const threadCpu = threads.stop();
          const dbCpu = cpuMsOf(dbPid) - dbCpu0;
          const { peak } = sampler.stop();
          if (state.status !== 'done') throw new Error(`import of ${n} members failed: ${state.failure?.error}: ${state.failure?.message}`);
          const tm = state.summary?.timings ?? {};
          runs.push({ ms, cpu, rex: tm.readAndExtractMs ?? NaN, check: tm.checkMs ?? NaN, geometry: tm.geometryMs ?? NaN, peak, hwm: hwmOk ? peakRssOf(app.pid) : NaN, before });
          console.log(`whole ${n} #${i + 1}: ${fmtMs(ms)} (${(ms / br.totalMs).toFixed(2)} × its bare read), app CPU ${fmtMs(cpu)} (worker read+extract ${fmtMs(tm.readAndExtractMs ?? NaN)}, check ${fmtMs(tm.checkMs ?? NaN)}${tm.storeWaitMs !== undefined ? ` of which waiting for the store ${fmtMs(tm.storeWaitMs)}` : ''}${tm.geometryMs !== undefined ? `, display geometry ${fmtMs(tm.geometryMs)}` : ''}), MariaDB CPU ${fmtMs(dbCpu)}, app RSS ${fmtMb(before)} → peak ${fmtMb(peak)} (VmHWM ${fmtMb(runs.at(-1)!.hwm)})`);
          if (flag('timeline')) console.log(`  ${timeline.join(' → ')}`);
          console.log(`  app CPU by thread: ${Object.entries(threadCpu).filter(([, ms]) => ms >= 50).sort((a, b) => b[1] - a[1]).map(([name, ms]) => `${name} ${fmtMs(ms)}`).join(', ')}`);
          // The 3D geometry is built after the results are stored; let it finish so the next import
          // starts on an idle app (a quick run waits only when another import follows).
          if (flag('quick') && i + 1 >= repeatFor(n) && n === sizes.at(-1)) continue;
          const geo = await waitForGeometry(app.url, session, projectId, up.revisionId);
          // "Ready" comes before the app is done with the geometry's aftermath (collections that
          // give web-ifc's memory back, the stored file): the next import waits until the app is idle.
          const settledMs = await waitForIdleProcess(app.pid);
          if (flag('quick')) continue;
          if (geo) {
            runs.at(-1)!.geometryAfter = geo.ms;
            console.log(`  3D geometry ${geo.state} ${fmtMs(geo.ms)} after the results; app idle ${fmtMs(settledMs)} later`);
          }
        }
        const b: ImportRow['bare'] = { total: spread(bareRuns.map((r) => r.totalMs)), cpu: spread(bareRuns.map((r) => r.cpuMs)), open: spread(bareRuns.map((r) => r.openMs)), list: spread(bareRuns.map((r) => r.listMs)), lines: bareRuns[0].lines };
        const pairRatios = runs.map((r, i) => r.ms / bareRuns[i].totalMs);
        const whole = spread(runs.map((r) => r.ms));
        const peakRss = spread(runs.map((r) => r.peak));
        rows.push({
          members: n, fileBytes, generation: files.get(n)!.gen, bare: b,
          whole: {
            ms: whole, cpu: spread(runs.map((r) => r.cpu)), runs: runs.map((r) => Math.round(r.ms)),
            worker: { readAndExtractMs: spread(runs.map((r) => r.rex)), checkMs: spread(runs.map((r) => r.check)), geometryMs: spread(runs.map((r) => r.geometry)) },
            geometryAfterMs: runs.some((r) => r.geometryAfter !== undefined) ? spread(runs.map((r) => r.geometryAfter ?? NaN)) : null,
            peakRss, peakRssHwm: spread(runs.map((r) => r.hwm)), rssBefore: spread(runs.map((r) => r.before)), idleApp,
          },
          pairRatios,
          ratio: { wholeOverBare: median(pairRatios), cpuOverBareCpu: median(runs.map((r) => r.cpu)) / b.cpu.median, peakRssOverFile: peakRss.max / fileBytes, addedOverFile: (peakRss.max - idleApp) / fileBytes },
        });
      }
    } finally {
      await app.stop();
    }

    if (flag('quick')) return;
    // 4. In-process runs: phase breakdown, heap, hand-over size (and CPU profiles with --profile).
    const profDir = path.join(BENCH_DIR, 'profiles');
    for (const row of rows) {
      const nodeArgs = ['--max-old-space-size=4096', ...(profile ? ['--cpu-prof', `--cpu-prof-dir=${profDir}`, `--cpu-prof-name=import-${row.members}.cpuprofile`] : [])];
      row.direct = await runChild('direct', [`--file=${files.get(row.members)!.file}`], db.env, nodeArgs);
      const d = row.direct!;
      console.log(`in-process ${row.members}: ${Object.entries(d.ms).map(([k, v]) => `${k} ${fmtMs(v)}`).join(', ')}; heap peak ${fmtMb(d.heapPeak)}, RSS peak ${fmtMb(d.rssPeak)}, hand-over ${fmtMb(d.cloneBytes)}`);
    }
    if (profile) console.log(`CPU profiles in ${path.relative(ROOT, profDir)}/`);
  } finally {
    await db.stop();
  }

  // 5. Tables.
  console.log(`\n${BARE_DEFINITION}\n${WHOLE_DEFINITION}\nMedians of ${sizes.map(repeatFor).join('/')} imports per size (min–max in brackets); whole / bare is the median of the pairs, their range in brackets.\n`);
  console.log(importTable(rows));
  console.log('\nIn-process phases (one run each; same code as the worker, in the main thread; heap = V8 heapUsed peak, sampled every 50 ms):\n');
  console.log(phaseTable(rows));
  const file = writeResults('import', { date: new Date().toISOString(), loadAverage: { start: loadStart, end: os.loadavg() }, repeat: sizes.map(repeatFor).join('/'), bareDefinition: BARE_DEFINITION, wholeDefinition: WHOLE_DEFINITION, rows });
  console.log(`\nresults: ${path.relative(ROOT, file)}`);
}

export function importTable(rows: ImportRow[]): string {
  return table(
    ['members', 'file', 'bare', 'whole import', 'whole / bare', 'CPU: bare → whole (app)', 'CPU ratio', 'peak RSS (app)', 'peak RSS / file', 'added by the import / file'],
    rows.map((r) => [
      r.members.toLocaleString('en'), fmtMb(r.fileBytes), fmtSpread(r.bare.total, fmtMs), fmtSpread(r.whole.ms, fmtMs),
      `${r.ratio.wholeOverBare.toFixed(2)}${r.pairRatios?.length ? ` (${Math.min(...r.pairRatios).toFixed(2)}–${Math.max(...r.pairRatios).toFixed(2)})` : ''}${r.members >= 20_000 ? (r.ratio.wholeOverBare <= 3 ? ' ≤ 3 ✓' : ' target ≤ 3 ✗') : ''}`,
      `${fmtMs(r.bare.cpu.median)} → ${fmtMs(r.whole.cpu.median)}`, r.ratio.cpuOverBareCpu.toFixed(2),
      fmtSpread(r.whole.peakRss, fmtMb), r.ratio.peakRssOverFile.toFixed(2),
      r.ratio.addedOverFile === undefined ? '—' : `${r.ratio.addedOverFile.toFixed(2)} ${r.ratio.addedOverFile <= 8 ? '(≤ 8 ✓)' : '(target ≤ 8 ✗)'}`,
    ]),
  );
}

export function phaseTable(rows: ImportRow[]): string {
  const opt = (v: number | undefined) => (v === undefined ? '—' : fmtMs(v));
  return table(
    ['members', 'read + extract', 'check', 'display geometry', 'task total', 'hand-over clone', 'store (MariaDB)', 'heap peak', 'RSS peak', 'hand-over size', 'detail JSON', 'result JSON', 'geometry file'],
    rows.filter((r) => r.direct).map((r) => {
      const d = r.direct!;
      return [
        r.members.toLocaleString('en'), opt(d.ms.readAndExtractMs), opt(d.ms.checkMs), opt(d.ms.geometryMs), fmtMs(d.ms.task), fmtMs(d.ms.clone), fmtMs(d.ms.store),
        fmtMb(d.heapPeak), fmtMb(d.rssPeak), fmtMb(d.cloneBytes), fmtMb(d.detailBytes), fmtMb(d.resultBytes), d.geometryBytes === null ? '—' : fmtMb(d.geometryBytes),
      ];
    }),
  );
}

const child = arg('child');
if (process.argv[1] && path.resolve(process.argv[1]) === SELF) {
  const run = child === 'generate' ? childGenerate(Number(arg('n')), arg('out')!)
    : child === 'bare' ? childBare(arg('file')!)
    : child === 'direct' ? childDirect(arg('file')!)
    : child === 'seed' ? childSeed(arg('file')!, Number(arg('project')))
    : main();
  run.then(
    () => process.exit(0),
    (err) => {
      console.error(err instanceof Error ? err.stack : err);
      process.exit(1);
    },
  );
}

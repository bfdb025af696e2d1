/**
 * Read + extract alone (readIfcModel, the first phase of an import) on the synthetic models of
 * the import benchmark: wall and CPU time, web-ifc's OpenModel share, lines read (and how many
 * through web-ifc's GetLine), V8 heap and RSS peaks. One fresh child process per size and run,
 * so no run inherits another's memory; the wasm is initialised and the file is in memory before
 * the clock starts, as in the bare read of bench:import.
 *
 * Run: node --import tsx scripts/bench/read-extract.ts [--sizes=1000,5000,20000] [--repeat=N]
 * [--profile] (CPU profiles of the first run per size into .data/bench/profiles/read-extract-<n>/; the
 * largest file there is the main thread's)
 */
import { spawn } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ReadStats } from '../../server/ifc/types.ts';
import { BENCH_DIR, ROOT, fmtMb, fmtMs, fmtSpread, median, peakRssOf, spread, table } from './lib/bench-support.ts';

const SELF = fileURLToPath(import.meta.url);
const arg = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.split('=')[1];
const flag = (name: string) => process.argv.includes(`--${name}`);

interface ChildResult {
  members: number;
  fileBytes: number;
  wallMs: number;
  cpuMs: number;
  openMs: number;
  extractMs: number;
  linesRead: number;
  linesFromWebIfc: number;
  phases?: Record<string, number>;
  heapPeak: number;
  rssBefore: number;
  rssPeak: number;
}

async function child(file: string): Promise<void> {
  const { getIfcApi } = await import('../../server/ifc/ifc-api.ts');
  const { readIfcModel } = await import('../../server/ifc/read-model.ts');
  const bytes = new Uint8Array(readFileSync(file));
  await getIfcApi();
  const rssBefore = process.memoryUsage().rss;
  let heapPeak = 0;
  const sample = () => {
    heapPeak = Math.max(heapPeak, process.memoryUsage().heapUsed);
  };
  // readIfcModel yields to the event loop every 200 members, so the timer gets its turns.
  const timer = setInterval(sample, 50);
  const stats: ReadStats = { openMs: 0, extractMs: 0, linesRead: 0, linesFromWebIfc: 0 };
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const model = await readIfcModel(bytes, { stats });
  const wallMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  sample();
  clearInterval(timer);
  const result: ChildResult = {
    members: model.members.length, fileBytes: bytes.length, wallMs, cpuMs: (cpu.user + cpu.system) / 1000, ...stats,
    heapPeak, rssBefore, rssPeak: peakRssOf(process.pid),
  };
  process.stdout.write(`RESULT ${JSON.stringify(result)}\n`);
}

function runChild(file: string, profileName: string | null): Promise<ChildResult> {
  // One directory per run: tsx's loader thread writes a profile too, so a fixed name would be overwritten.
  const profArgs = profileName ? ['--cpu-prof', `--cpu-prof-dir=${path.join(BENCH_DIR, 'profiles', profileName)}`] : [];
  return new Promise((resolve, reject) => {
    const c = spawn(process.execPath, [...profArgs, '--max-old-space-size=8192', '--import', 'tsx', SELF, '--child', `--file=${file}`], { stdio: ['ignore', 'pipe', 'inherit'], cwd: ROOT });
    let out = '';
    c.stdout.on('data', (d) => (out += d));
    c.on('exit', (code) => {
      const line = out.split('\n').find((l) => l.startsWith('RESULT '));
      if (code === 0 && line) resolve(JSON.parse(line.slice(7)) as ChildResult);
      else reject(new Error(`child exited with ${code}: ${out.slice(-2000)}`));
    });
  });
}

async function main(): Promise<void> {
  const { ensureModels } = await import('./import.ts');
  const sizes = (arg('sizes') ?? '1000,5000,20000').split(',').map(Number).filter((n) => n > 0);
  const repeat = Number(arg('repeat') ?? 3);
  const profile = flag('profile');
  if (profile) mkdirSync(path.join(BENCH_DIR, 'profiles'), { recursive: true });
  const models = await ensureModels(sizes);
  const load0 = os.loadavg()[0];
  const rows: string[][] = [];
  const results: Record<number, ChildResult[]> = {};
  for (const n of sizes) {
    const runs: ChildResult[] = [];
    for (let i = 0; i < repeat; i++) {
      runs.push(await runChild(models.get(n)!.file, profile && i === 0 ? `read-extract-${n}` : null));
      console.log(`${n} members, run ${i + 1}: ${fmtMs(runs.at(-1)!.wallMs)}`);
    }
    results[n] = runs;
    const r = runs[0];
    const s = (f: (x: ChildResult) => number) => spread(runs.map(f));
    rows.push([
      n.toLocaleString('en'), fmtMb(r.fileBytes), fmtSpread(s((x) => x.wallMs), fmtMs), fmtMs(median(runs.map((x) => x.cpuMs))),
      fmtMs(median(runs.map((x) => x.openMs))), fmtMs(median(runs.map((x) => x.extractMs))),
      r.linesRead.toLocaleString('en'), r.linesFromWebIfc.toLocaleString('en'),
      fmtMb(median(runs.map((x) => x.heapPeak))), fmtMb(median(runs.map((x) => x.rssPeak))), (median(runs.map((x) => x.rssPeak)) / r.fileBytes).toFixed(2),
    ]);
  }
  console.log(`\nRead + extract (readIfcModel), ${repeat} run(s) per size, median (min–max); load average ${load0.toFixed(1)} → ${os.loadavg()[0].toFixed(1)}.\n`);
  console.log(table(['members', 'file', 'read + extract', 'CPU', 'of which open', 'extract', 'lines read', 'via GetLine', 'heap peak', 'RSS peak', 'RSS / file'], rows));
  console.log('\nExtraction phases (first run per size):');
  for (const n of sizes) {
    const p = results[n][0].phases ?? {};
    console.log(`  ${n.toLocaleString('en')}: ${Object.entries(p).map(([k, v]) => `${k} ${fmtMs(v)}`).join(', ')}`);
  }
  writeFileSync(path.join(BENCH_DIR, 'results-read-extract.json'), JSON.stringify({ at: new Date().toISOString(), results }, null, 2));
}

if (process.argv[1] && path.resolve(process.argv[1]) === SELF) {
  (flag('child') ? child(arg('file')!) : main()).then(
    () => process.exit(0),
    (err) => {
      console.error(err instanceof Error ? err.stack : err);
      process.exit(1);
    },
  );
}

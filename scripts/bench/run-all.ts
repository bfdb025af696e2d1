/**
 * npm run bench: the engine, import and API benchmarks in sequence (and the viewer benchmark
 * when scripts/bench/viewer.ts exists), then docs/benchmarks.md with the machine, the date,
 * every table and the targets. Extra arguments go to the import benchmark (e.g. -- --big);
 * -- --skip-viewer leaves the viewer benchmark out; -- --report-only rewrites the report from the last run.
 */
import { execFileSync, spawn } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ROOT, fmtMs, readResults, writeResults } from './lib/bench-support.ts';
import { importTable, phaseTable, type ImportRow } from './import.ts';
import { apiTable, type ApiResults } from './api.ts';

interface Ran {
  name: string;
  ok: boolean;
  output: string;
  ms: number;
}

/** Runs one bench script, echoing and keeping its output. */
function runBench(name: string, script: string, args: string[] = []): Promise<Ran> {
  return new Promise((resolve) => {
    console.log(`\n==== ${name}: node --import tsx ${script} ${args.join(' ')}`);
    const t0 = performance.now();
    const child = spawn(process.execPath, ['--import', 'tsx', script, ...args], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (d: Buffer) => {
      process.stdout.write(d);
      output += d;
    });
    child.stderr.on('data', (d: Buffer) => {
      process.stderr.write(d);
      output += d;
    });
    child.on('exit', (code) => resolve({ name, ok: code === 0, output, ms: performance.now() - t0 }));
  });
}

function machine(): string[] {
  const cpuinfo = existsSync('/proc/cpuinfo') ? readFileSync('/proc/cpuinfo', 'utf8') : '';
  const model = /model name\s*:\s*(.+)/.exec(cpuinfo)?.[1] ?? os.cpus()[0]?.model ?? 'unknown';
  return [
    `- CPU: ${model}, ${os.availableParallelism()} cores (nproc)`,
    `- Memory: ${(os.totalmem() / 1024 ** 3).toFixed(1)} GiB`,
    `- Node ${process.version} on ${os.type()} ${os.release()}`,
    `- web-ifc ${JSON.parse(readFileSync(path.join(ROOT, 'node_modules/web-ifc/package.json'), 'utf8')).version}, MariaDB ${mariadbVersion()}`,
  ];
}

function mariadbVersion(): string {
  try {
    const bin = ['/usr/sbin/mariadbd', '/usr/bin/mariadbd'].find((b) => existsSync(b)) ?? 'mariadbd';
    const out = execFileSync(bin, ['--version'], { encoding: 'utf8' });
    return /Ver\s+(\S+)/.exec(out)?.[1] ?? out.trim();
  } catch {
    return 'unknown';
  }
}

const fence = (s: string) => ['```text', s.trimEnd(), '```'].join('\n');
const load = (l?: { start: number[]; end: number[] }) => (l ? `load average ${l.start[0].toFixed(1)} at the start, ${l.end[0].toFixed(1)} at the end` : '');

async function main(): Promise<void> {
  // --report-only: write docs/benchmarks.md again from the last run's stored results.
  if (process.argv.includes('--report-only')) {
    const last = readResults<{ started: string; loadStart: number[]; loadEnd: number[]; runs: Ran[] }>('runs');
    if (!last) throw new Error('no stored run; run npm run bench first');
    writeReport(new Date(last.started), last.loadStart, last.loadEnd, last.runs);
    return;
  }
  const started = new Date();
  const loadStart = os.loadavg();
  const runs: Ran[] = [];
  runs.push(await runBench('engine', 'scripts/bench/engine.ts'));
  runs.push(await runBench('import', 'scripts/bench/import.ts', process.argv.slice(2).filter((a) => a !== '--skip-viewer')));
  runs.push(await runBench('api', 'scripts/bench/api.ts'));
  const viewer = path.join(ROOT, 'scripts/bench/viewer.ts');
  if (existsSync(viewer) && !process.argv.includes('--skip-viewer')) runs.push(await runBench('viewer', 'scripts/bench/viewer.ts'));
  const loadEnd = os.loadavg();
  writeResults('runs', { started: started.toISOString(), loadStart, loadEnd, runs });
  writeReport(started, loadStart, loadEnd, runs);
  if (runs.some((r) => !r.ok)) process.exit(1);
}

function writeReport(started: Date, loadStart: number[], loadEnd: number[], runs: Ran[]): void {

  const imp = readResults<{ date: string; repeat: string; bareDefinition: string; wholeDefinition: string; rows: ImportRow[]; loadAverage?: { start: number[]; end: number[] } }>('import');
  const api = readResults<ApiResults>('api');
  const md: string[] = [
    '# Benchmarks',
    '',
    `Measured ${started.toISOString().slice(0, 16).replace('T', ' ')} UTC with \`npm run bench\` (${runs.map((r) => `${r.name} ${r.ok ? 'ok' : 'FAILED'} in ${fmtMs(r.ms)}`).join(', ')}).`,
    '',
    '## Machine',
    '',
    ...machine(),
    `- Load average (1 min) ${loadStart[0].toFixed(1)} at the start and ${loadEnd[0].toFixed(1)} at the end of the run.`,
    '',
    '## Noise',
    '',
    'This machine is shared: colleagues\' test runs compete for the two cores, so wall-clock numbers move by tens of per cent',
    'between runs (the load average above says how busy it was). Every import is repeated and shown as median (min–max);',
    'compare ratios (whole / bare, memory / file size) rather than raw seconds, and re-run before drawing conclusions from',
    'a difference under ~30 %. The load generator of the API benchmark runs on the same two cores as the app it measures.',
    '',
    '## Engine (`npm run bench:engine`)',
    '',
    fence(runs.find((r) => r.name === 'engine')?.output ?? 'not run'),
    '',
    '## Import (`npm run bench:import`)',
    '',
  ];
  if (imp) {
    md.push(
      'Synthetic IFC4 models from `makeSyntheticModel(n)`: n flat braces, each with a material profile set, four bolt holes',
      '(opening elements), two bolt groups (mapped fastener geometry) and five property sets; about 8 KB of IFC per member.',
      '',
      `- ${imp.bareDefinition}`,
      `- ${imp.wholeDefinition}`,
      '- Peak RSS is the app process (request thread, import worker threads, reader thread), sampled every 50 ms from /proc while the import runs; the idle app before the upload is',
      `  ${imp.rows.map((r) => `${(r.whole.rssBefore.median / 1048576).toFixed(0)} MB`).join(' / ')} for these sizes (it keeps its import threads, their wasm memory and caches between imports).`,
      `- Generation time (cached in .data/bench/, not part of any number): ${imp.rows.map((r) => `${r.members.toLocaleString('en')}: ${r.generation.cached ? 'cached' : fmtMs(r.generation.ms ?? 0)}`).join(', ')}.`,
      `- Whole imports per size: ${imp.repeat}; ${load(imp.loadAverage)}.`,
      '- Targets: whole / bare at most 3 at 20,000 members; peak memory at most 8 × file size, held to the memory the import adds to the idle app',
      `  (${imp.rows[0]?.whole.idleApp ? `${(imp.rows[0].whole.idleApp / 1048576).toFixed(0)} MB here` : 'measured once after the warm-up'}; decision 0008): an idle app does not grow with the file, and counted in, no file under about 60 MB could meet any fixed ratio.`,
      '',
      fence(importTable(imp.rows)),
      '',
      'Where the time goes (worker timings from the revision summary, medians):',
      '',
      fence(
        imp.rows
          .map((r) => `${r.members.toLocaleString('en').padStart(7)} members: read + extract ${fmtMs(r.whole.worker.readAndExtractMs.median)}, check ${fmtMs(r.whole.worker.checkMs.median)}${Number.isFinite(r.whole.worker.geometryMs?.median) ? `, display geometry ${fmtMs(r.whole.worker.geometryMs.median)}` : ''} of ${fmtMs(r.whole.ms.median)} whole${r.whole.geometryAfterMs ? `; 3D view ready ${fmtMs(r.whole.geometryAfterMs.median)} after the results (not in "whole")` : ''}`)
          .join('\n'),
      ),
      '',
      'The same task in one process, phase by phase, with V8 heap (one run per size):',
      '',
      fence(phaseTable(imp.rows)),
      '',
    );
  } else md.push('No results (the import benchmark failed).', '');
  md.push('## API under load (`npm run bench:api`)', '');
  if (api) {
    md.push(
      `${api.members.toLocaleString('en')}-member revision (${(api.fileBytes / 1048576).toFixed(0)} MB file, imported in ${fmtMs(api.importMs)} ${api.via === 'api' ? 'through the upload API' : 'by read, extract, check and storeOutcome in a child process: no display geometry, which the table and sheet do not use; --via=api uploads instead'}), ${api.connections} signed-in clients on loopback`,
      `(autocannon, one session per connection), ${api.durationS.toFixed(1)} s, bounded by ${api.seconds} s or ${api.requestLimit.toLocaleString('en')} requests. ${api.mix};`,
      `table requests mix sort keys, directions, band filters, minimum utilisation, searches and pages (${Object.entries(api.samples).map(([k, v]) => `${k} ${v}`).join(', ')}); sheets ask for random members.`,
      api.coldFirstMs !== undefined ? `Before the timed run: the first table page after the import took ${fmtMs(api.coldFirstMs)} (the app loads its copy of the table), and one request per sort key and direction ${fmtMs(api.warmUpMs ?? NaN)} in all.` : '',
      `Errors ${api.errors}, timeouts ${api.timeouts}; app RSS peak ${(api.appRssPeak / 1048576).toFixed(0)} MB; ${load(api.loadAverage)}. Target: p95 under 100 ms.`,
      api.cpuMsPerRequest ? `CPU per answered request during the run (user + system, all threads): app ${api.cpuMsPerRequest.app.toFixed(2)} ms, MariaDB ${api.cpuMsPerRequest.database.toFixed(2)} ms, load tool ${api.cpuMsPerRequest.loadTool.toFixed(2)} ms — all three share the machine's cores.` : '',
      '',
      fence(apiTable(api)),
      '',
    );
  } else md.push('No results (the API benchmark failed).', '');
  const viewerRun = runs.find((r) => r.name === 'viewer');
  if (viewerRun) md.push('## Viewer (`scripts/bench/viewer.ts`, a colleague\'s)', '', fence(viewerRun.output.replace(/\x1b\[[0-9;]*m/g, '')), '');
  const notes = path.join(ROOT, 'scripts/bench/findings.md');
  if (existsSync(notes)) md.push(readFileSync(notes, 'utf8').trim(), '');
  writeFileSync(path.join(ROOT, 'docs/benchmarks.md'), md.join('\n'));
  console.log('\nwrote docs/benchmarks.md');
}

main().catch((err) => {
  console.error(err instanceof Error ? err.stack : err);
  process.exit(1);
});

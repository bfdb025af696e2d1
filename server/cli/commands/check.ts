/**
 * `gaugeline check MODEL.ifc [options]` — the server's import pipeline without the server:
 * read the model (in a worker, with a time limit), apply a forces table, check every
 * member, and print JSON or write any export format. See check-options.ts for options.
 */
import { readFile, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { parseForcesCsv, type ForceRow } from '../../../shared/forces/parse-forces-csv.ts';
import { identifyGrade } from '../../../shared/engine/materials/parse-grade.ts';
import { readUploadBytes } from '../../imports/read-upload-bytes.ts';
import { bundleFromRecords, selectRecords } from '../../exports/bundle-from-records.ts';
import { CRITICAL_BANDS } from '../../exports/export-bundle.ts';
import { CliInputError } from '../cli-error.ts';
import { parseCheckOptions, type CheckOptions } from '../check-options.ts';
import { checkJson } from '../check-json.ts';
import { runImportInWorker } from '../run-import-in-worker.ts';

/** Far above any real model; only stops a zip bomb. */
const INFLATE_LIMIT_BYTES = 2 * 1024 ** 3;

const kindOf = (file: string): 'ifc' | 'ifczip' => (/\.ifczip$/i.test(file) ? 'ifczip' : 'ifc');

async function assertReadableFile(file: string, what: string): Promise<void> {
  try {
    const s = await stat(file);
    if (!s.isFile()) throw new CliInputError(`${file}: ${what} is not a file`);
  } catch (e) {
    if (e instanceof CliInputError) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    throw new CliInputError(`${file}: cannot read ${what} (${code === 'ENOENT' ? 'no such file' : (code ?? 'error')})`);
  }
}

async function readForces(file: string): Promise<ForceRow[]> {
  await assertReadableFile(file, 'forces file');
  const parsed = parseForcesCsv(await readFile(file, 'utf8'));
  const first = parsed.problems[0];
  if (first) throw new CliInputError(`${file}: ${first.line ? `line ${first.line}: ` : ''}${first.message}${parsed.problems.length > 1 ? ` (and ${parsed.problems.length - 1} more problem(s))` : ''}`);
  return parsed.rows;
}

async function emit(opts: CheckOptions, body: string | Buffer): Promise<void> {
  if (opts.out) await writeFile(opts.out, body);
  else process.stdout.write(body);
}

export async function run(args: string[]): Promise<void> {
  const opts = parseCheckOptions(args);
  if (!identifyGrade(opts.grade)) throw new CliInputError(`--grade: unknown steel grade "${opts.grade}"`);
  await assertReadableFile(opts.model, 'model');
  const forceRows = opts.forces ? await readForces(opts.forces) : undefined;

  const outcome = await runImportInWorker(
    { filePath: path.resolve(opts.model), kind: kindOf(opts.model), standard: opts.standard, defaultGrade: opts.grade, inflateLimitBytes: INFLATE_LIMIT_BYTES, forceRows },
    opts.timeLimitSeconds,
    opts.model,
  );
  if (!outcome.ok) throw new CliInputError(`${opts.model}: ${outcome.failure.message}`);
  // The server imports what survives of a cut file, with a warning a person sees; a script
  // would not see it, so here a cut file is an error rather than a silently partial answer.
  if (outcome.summary.warnings.some((w) => w.code === 'file.truncated')) {
    throw new CliInputError(`${opts.model}: the file ends early (truncated); only part of the model could be read`);
  }
  const checkedAt = new Date().toISOString();

  if (opts.format === 'json') {
    const listed = outcome.members.filter((m) => opts.all || m.isTension);
    return emit(opts, `${JSON.stringify(checkJson(listed, outcome.summary, opts, checkedAt), null, 2)}\n`);
  }

  // Exports list what the web app exports by default: tension members with a result
  // (every candidate with --all); BCF only the critical ones.
  const bands = opts.format === 'bcf' ? CRITICAL_BANDS : undefined;
  const records = selectRecords(outcome.members, { scope: opts.all ? 'all' : 'tension', bands });
  const fileName = path.basename(opts.model);
  const modelName = fileName.replace(/\.(ifczip|ifc)$/i, '');
  const bundle = bundleFromRecords(records, {
    // Without a server there is no project; the model names it.
    projectName: modelName,
    modelName,
    fileName,
    standard: opts.standard,
    checkedAt,
    generatedAt: checkedAt,
    filterDescription: `${opts.all ? 'all steel members' : 'tension members'} with a check result${bands ? ` in band(s) ${bands.join(', ')}` : ''}`,
  });
  // Loaded only here: the writers pull in pdfkit and exceljs, which JSON runs never need.
  const { writeExport } = await import('../../exports/export-formats.ts');
  const body = await writeExport(opts.format, bundle, { modelBytes: () => readUploadBytes(opts.model, kindOf(opts.model), INFLATE_LIMIT_BYTES) });
  await emit(opts, body);
}

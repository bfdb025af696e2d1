/**
 * readIfcModel: bytes in, plain SI data out. Every line object is built by web-ifc's own line
 * constructors; lines come from the file's text where that gives the same objects
 * (step-text.ts). No geometry kernel calls: engineering geometry comes from placements and
 * profile parameters. Meant to run inside a worker with a time limit; progress is reported per
 * phase.
 *
 * Two ways to the same model (decision 0014):
 * - text first: when the text is regular (every statement complete and without comments,
 *   every id once, every class listed exactly, the file not cut off), classes are listed from
 *   the text's index and web-ifc's model is opened only if some line or placement needs web-ifc
 *   itself. If web-ifc then counts other lines than the text shows (its tokeniser lost a line
 *   of a damaged file), the read steps back to the second way.
 *   From 64 MB up, a second thread indexes the second half of the text meanwhile, then reads the
 *   bolt groups while this one reads members (reader-thread.ts).
 * - web-ifc first: web-ifc opens the model here, as it always did; lines still come from the
 *   text when both count the same lines.
 */
import type { IfcAPI } from 'web-ifc';
import { extractModel } from './extract-model.ts';
import { getIfcApi } from './ifc-api.ts';
import { IfcReadError, isIfcReadError } from './ifc-errors.ts';
import { ModelContext } from './model-context.ts';
import type { BoltGroupsAnswer } from './bolt-groups-read.ts';
import { askReaderThread, prewarmReaderThread, type ReaderThreadWork, shareable } from './reader-thread.ts';
import { checkHeader, openModel } from './open-model.ts';
import { StepText } from './step-text.ts';
import type { ExtractedModel, ReadOptions } from './types.ts';

/**
 * From this size up the reader thread indexes half the text and reads the bolt groups. From 16 MB
 * it was faster (decision 0014), but below 64 MB the thread, its young generation and its half of
 * the index and groups took a medium file's import over 8 × the file in memory (decision 0017):
 * imports of 16–64 MB read alone, about a tenth slower. The large-file import pool starts at the
 * same size (import-pools.ts; a test holds them equal).
 */
export const READER_THREAD_FROM_BYTES = 64 * 1024 * 1024;

export async function readIfcModel(bytes: Uint8Array, options: ReadOptions = {}): Promise<ExtractedModel> {
  if (!options.webIfcFirst && options.readLinesWith !== 'web-ifc') {
    const read = await readTextFirst(bytes, options);
    if ('model' in read) return read.model;
    // The text is indexed already; web-ifc opens the file here and decides whether it may be used.
    return readOpened(bytes, options, read.text);
  }
  return readOpened(bytes, options);
}

/** CPU time per phase of the read (ReadStats.phases): on a shared machine wall time says more about the neighbours. */
function phaseClock(options: ReadOptions) {
  const phases: Record<string, number> = {};
  const cpuMs = () => {
    const u = process.cpuUsage();
    return (u.user + u.system) / 1000;
  };
  let tPhase = options.stats ? cpuMs() : 0;
  const mark = (name: string) => {
    if (!options.stats) return;
    const t = cpuMs();
    phases[name] = (phases[name] ?? 0) + t - tPhase;
    tPhase = t;
  };
  return { phases, mark };
}

function recordStats(options: ReadOptions, openMs: number, tExtract: number, ctx: ModelContext | null, phases: Record<string, number>): void {
  if (!options.stats) return;
  options.stats.openMs = openMs;
  options.stats.extractMs = performance.now() - tExtract;
  options.stats.linesRead = ctx?.linesRead ?? 0;
  options.stats.linesFromWebIfc = ctx?.linesFromWebIfc ?? 0;
  options.stats.phases = phases;
}

const asReadError = (e: unknown) => (isIfcReadError(e) ? e : new IfcReadError('ifc.parse-failed', e instanceof Error ? e.message : String(e), { cause: e }));

/** web-ifc counted other lines than the text shows: the text-first read is given up. */
class StepBack extends Error {}

/**
 * The text-first way. Gives the text back when it cannot stand in for web-ifc's lists, or when
 * web-ifc, opened for a line the text could not read exactly, counts other lines (then the
 * caller reads the web-ifc-first way without indexing again). A file web-ifc cannot open fails
 * here only if some line needed web-ifc; the 3D geometry opens every file with web-ifc later.
 */
async function readTextFirst(bytes: Uint8Array, options: ReadOptions): Promise<{ model: ExtractedModel } | { text: StepText }> {
  const progress = options.progress ?? (() => {});
  progress('reading', 0);
  const header = checkHeader(bytes);
  const api = await getIfcApi();
  const tStart = performance.now();
  const { phases, mark } = phaseClock(options);
  let openedHere: number | null = null;
  let ctx: ModelContext | null = null;
  const inThread = !header.truncated && (options.readerThread ?? bytes.length >= READER_THREAD_FROM_BYTES);
  // Loading while the text is indexed; it reads the bolt groups from this thread's index.
  if (inThread) prewarmReaderThread();
  // Both threads read the same memory.
  if (inThread) bytes = shareable(bytes);
  const split = inThread ? StepText.splitPoint(bytes) : null;
  const restRead = split !== null ? askReaderThread({ kind: 'index-rest', bytes, from: split }) : null;
  let boltRead: ReaderThreadWork<BoltGroupsAnswer> | null = null;
  try {
    const codeOf = (name: string) => api.GetTypeCodeFromName(name);
    const text = split !== null ? StepText.indexUpTo(bytes, split, codeOf) : StepText.index(bytes, codeOf);
    if (restRead) {
      const rest = await restRead.answer;
      text.finishFrom(rest.ok ? rest.rest : null);
    }
    if (header.truncated || !text.regular) return { text };
    const index = inThread ? text.snapshot() : null;
    if (index) boltRead = askReaderThread({ kind: 'bolt-groups', bytes, index, schema: header.schema, schemaIdentifier: header.schemaIdentifier, cacheSize: options.cacheSize });
    // Opened only when a line or placement needs web-ifc itself; a failure is kept, not retried per line.
    let openError: unknown = null;
    const openHere = () => {
      if (openError) throw openError;
      if (openedHere !== null) return openedHere;
      try {
        openedHere = openModel(api, bytes).modelID;
      } catch (e) {
        throw (openError = e);
      }
      if (lineCount(api, openedHere) !== text.size) throw (openError = new StepBack());
      return openedHere;
    };
    ctx = new ModelContext(api, openHere, header.schema, options.cacheSize, text, { schemaIdentifier: header.schemaIdentifier });
    if (!ctx.listsFromText) return { text };
    if (options.stats) options.stats.textReader = true;
    mark('text index');
    progress('reading', 1);
    let model: ExtractedModel | null = null;
    let failure: unknown = null;
    try {
      model = await extractModel({ ctx, header, options, mark, boltGroups: boltRead?.answer });
    } catch (e) {
      failure = e;
    }
    // Extractors treat a line they could not get as missing; a failed open decides here instead.
    if (openError instanceof StepBack) return { text };
    if (openError) throw asReadError(openError);
    if (failure) throw asReadError(failure);
    return { model: model! };
  } finally {
    restRead?.stop();
    boltRead?.stop();
    recordStats(options, 0, tStart, ctx, phases);
    if (openedHere !== null) closeQuietly(api, openedHere);
  }
}

/** web-ifc opens the model first, in this thread; lines then come from the text when both count the same lines. */
async function readOpened(bytes: Uint8Array, options: ReadOptions, indexed?: StepText): Promise<ExtractedModel> {
  const progress = options.progress ?? (() => {});
  progress('reading', 0);
  const api = await getIfcApi();
  const tOpen = performance.now();
  const opened = openModel(api, bytes);
  const tExtract = performance.now();
  const { phases, mark } = phaseClock(options);
  let ctx: ModelContext | null = null;
  try {
    progress('reading', 1);
    // Lines are read from the file's text wherever that gives web-ifc's own line objects
    // (step-text.ts), unless web-ifc counted other lines than the text shows (a damaged file).
    const text = options.readLinesWith === 'web-ifc' ? null : (indexed ?? StepText.index(bytes, (name) => api.GetTypeCodeFromName(name)));
    const agrees = text !== null && text.size === lineCount(api, opened.modelID);
    ctx = new ModelContext(api, opened.modelID, opened.schema, options.cacheSize, agrees ? text : null);
    if (options.stats) options.stats.textReader = agrees;
    mark('text index');
    return await extractModel({ ctx, header: opened, options, mark });
  } catch (e) {
    throw asReadError(e);
  } finally {
    recordStats(options, tExtract - tOpen, tExtract, ctx, phases);
    closeQuietly(api, opened.modelID);
  }
}

function closeQuietly(api: IfcAPI, modelID: number): void {
  try {
    api.CloseModel(modelID);
  } catch {
    // Closing a half-opened model can throw; nothing else to release.
  }
}

function lineCount(api: IfcAPI, modelID: number): number {
  try {
    return api.GetAllLines(modelID).size();
  } catch {
    return -1;
  }
}

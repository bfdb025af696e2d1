/**
 * readIfcModel: bytes in, plain SI data out. web-ifc validates every file and its line
 * constructors build every line object; lines come from the file's text where that gives the
 * same objects (step-text.ts). No geometry kernel calls: engineering geometry comes from
 * placements and profile parameters. Meant to run inside a worker with a time limit; progress
 * is reported per phase.
 *
 * Two ways to the same model:
 * - a large file is opened by web-ifc in a thread of its own (open-check.ts) while this thread
 *   reads the text and extracts, listing classes from the text's index; the model is kept only
 *   if web-ifc opened the file and counted the same lines. web-ifc's model is opened here as
 *   well only if some line or placement needs it.
 * - otherwise (small files, text that cannot list classes exactly, or the two disagree) web-ifc
 *   opens the model here first, as it always did.
 */
import type { IfcAPI } from 'web-ifc';
import { extractModel } from './extract-model.ts';
import { getIfcApi } from './ifc-api.ts';
import { IfcReadError, isIfcReadError } from './ifc-errors.ts';
import { ModelContext } from './model-context.ts';
import { startOpenCheck } from './open-check.ts';
import { checkHeader, openFailure, openModel } from './open-model.ts';
import { StepText } from './step-text.ts';
import type { ExtractedModel, ReadOptions } from './types.ts';

/** From this size up web-ifc opens the file in its own thread (below, starting the thread costs more than it saves). */
export const OPEN_CHECK_FROM_BYTES = 16 * 1024 * 1024;

export async function readIfcModel(bytes: Uint8Array, options: ReadOptions = {}): Promise<ExtractedModel> {
  const inThread = options.openInThread ?? bytes.length >= OPEN_CHECK_FROM_BYTES;
  if (inThread && options.readLinesWith !== 'web-ifc') {
    const read = await readWhileOpening(bytes, options);
    if ('model' in read) return read.model;
    // The text is indexed already; web-ifc opens the file here and decides again whether it may be used.
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

/**
 * The large-file way: web-ifc opens the file in another thread while this one extracts from
 * the text. Gives the text back when it cannot stand in for web-ifc's lists or the two disagree
 * (then the caller reads the usual way, without indexing it again). web-ifc's verdict comes first: a file it cannot open fails
 * here as it fails in readOpened, whatever the extraction made of it.
 */
async function readWhileOpening(bytes: Uint8Array, options: ReadOptions): Promise<{ model: ExtractedModel } | { text: StepText }> {
  const progress = options.progress ?? (() => {});
  progress('reading', 0);
  const header = checkHeader(bytes);
  const check = startOpenCheck(bytes);
  const api = await getIfcApi();
  const tStart = performance.now();
  const { phases, mark } = phaseClock(options);
  let openedHere: number | null = null;
  let ctx: ModelContext | null = null;
  try {
    const text = StepText.index(bytes, (name) => api.GetTypeCodeFromName(name));
    // Opened here too only when a line or placement needs web-ifc itself; a failure is kept, not retried per line.
    let openError: unknown = null;
    const openHere = () => {
      if (openError) throw openError;
      try {
        return (openedHere ??= openModel(api, bytes).modelID);
      } catch (e) {
        throw (openError = e);
      }
    };
    ctx = new ModelContext(api, openHere, header.schema, options.cacheSize, text, { schemaIdentifier: header.schemaIdentifier });
    if (!ctx.listsFromText) return { text };
    if (options.stats) {
      options.stats.textReader = true;
      options.stats.openInThread = true;
    }
    mark('text index');
    progress('reading', 1);
    let model: ExtractedModel | null = null;
    let failure: unknown = null;
    try {
      model = await extractModel({ ctx, header, options, mark });
    } catch (e) {
      failure = e;
    }
    const verdict = await check.answer;
    if (!verdict.ok) throw openFailure(header, verdict.message);
    if (verdict.lines !== text.size || verdict.schemaIndex !== ctx.listsSchemaIndex) return { text };
    if (failure) throw asReadError(failure);
    return { model: model! };
  } finally {
    check.stop();
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
    if (options.stats) {
      options.stats.textReader = agrees;
      options.stats.openInThread = false;
    }
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

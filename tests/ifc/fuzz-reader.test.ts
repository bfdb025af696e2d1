// Fuzzed IFC at the reader: deterministic mutated copies (seeded) of every corpus file and
// sample — cut short, flipped bytes, a malformed entity line, ENDSEC deleted, a huge string,
// duplicated ids, entity lines deleted, references rewired, random bytes after a header.
// Each read runs in a worker thread with a time limit: it must return a result or throw an
// IfcReadError, never another error, never run past the limit, and never leave the reader
// unable to read a good model correctly afterwards in the same thread.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { CORPUS_DIR, CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';
import { MUTATIONS, mutate } from '../support/ifc-mutations.ts';

const repoRoot = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');
const GOOD_MODEL = join(repoRoot, 'samples/kestrel-yard-shed.ifc');
const WORKERS = 2;

// ---------- the files ----------
const samples = SAMPLE_IFC_FILES;
const corpus = CORPUS_IFC_FILES;
if (!corpus.length) console.warn(`IFC corpus not found in ${CORPUS_DIR}; only the samples are fuzzed.`);

/** Large files read slowly: they get the mutations most likely to reach deep into the reader. */
const BIG_FILE_MUTATIONS = ['flipped bytes', 'references rewired'];
const isBig = (size: number) => size > 1_000_000;

// ---------- a small pool of reader threads with a time limit per read ----------
interface Outcome {
  ok: boolean;
  summary?: unknown;
  ifcReadError?: boolean;
  errorId?: string | null;
  name?: string;
  message?: string;
}
interface Reply {
  id: number;
  ms: number;
  outcome: Outcome;
  goodAfter: unknown;
}

class ReaderPool {
  private idle: Worker[] = [];
  private waiting: ((w: Worker) => void)[] = [];
  private next = 1;
  good: unknown;

  async start(n: number): Promise<void> {
    await Promise.all(Array.from({ length: n }, async () => this.release(await this.spawn())));
  }

  private spawn(): Promise<Worker> {
    const w = new Worker(new URL('./fuzz/read-worker.mjs', import.meta.url), { workerData: { goodModel: GOOD_MODEL }, resourceLimits: { maxOldGenerationSizeMb: 1024 } });
    return new Promise((resolve, reject) => {
      w.once('message', (m: { ready: boolean; good: unknown }) => {
        this.good = m.good;
        resolve(w);
      });
      w.once('error', reject);
    });
  }

  private release(w: Worker): void {
    const waiter = this.waiting.shift();
    if (waiter) waiter(w);
    else this.idle.push(w);
  }

  private acquire(): Promise<Worker> {
    const w = this.idle.pop();
    return w ? Promise.resolve(w) : new Promise((resolve) => this.waiting.push(resolve));
  }

  /** Reads the bytes in a worker; a worker that overruns the limit or dies is replaced. */
  async read(bytes: Buffer, limitMs: number): Promise<Reply | { timedOut: true } | { died: string }> {
    const w = await this.acquire();
    const id = this.next++;
    const result = await new Promise<Reply | { timedOut: true } | { died: string }>((resolve) => {
      const timer = setTimeout(() => resolve({ timedOut: true }), limitMs);
      const onMessage = (m: Reply) => {
        if (m.id !== id) return;
        clearTimeout(timer);
        resolve(m);
      };
      w.on('message', onMessage);
      w.once('error', (e) => {
        clearTimeout(timer);
        resolve({ died: String(e) });
      });
      w.postMessage({ id, bytes: new Uint8Array(bytes) });
    });
    w.removeAllListeners('message');
    w.removeAllListeners('error');
    if ('id' in result) this.release(w);
    else {
      await w.terminate();
      this.release(await this.spawn());
    }
    return result;
  }

  async stop(): Promise<void> {
    await Promise.all(this.idle.map((w) => w.terminate()));
  }
}

const pool = new ReaderPool();
/** How the mutated files ended: "read" or an IfcReadError id, with a count each. */
const tally = new Map<string, number>();
beforeAll(async () => {
  await pool.start(WORKERS);
}, 60_000);
afterAll(async () => {
  await pool.stop();
  console.log(`fuzzed reads: ${JSON.stringify(Object.fromEntries([...tally].sort()))}`);
});

let cases = 0;
for (const file of [...samples, ...corpus]) {
  const bytes = readFileSync(file);
  const kinds = isBig(bytes.length) ? BIG_FILE_MUTATIONS : Object.keys(MUTATIONS);
  // The limit is generous for this shared machine; a hang is what it is there to catch.
  const limitMs = 20_000 + 8 * bytes.length / 1000;
  describe.concurrent(`fuzzed ${basename(file)}`, () => {
    for (const kind of kinds) {
      cases++;
      it(`${kind}: a result or an IfcReadError within ${Math.round(limitMs / 1000)} s, and the reader still reads a good model`, async () => {
        const mutated = mutate(bytes, basename(file), kind);
        const reply = await pool.read(mutated, limitMs);
        expect('timedOut' in reply, `the read did not finish within ${limitMs} ms`).toBe(false);
        expect('died' in reply ? reply.died : null, 'the reader thread died').toBeNull();
        const { outcome, goodAfter } = reply as Reply;
        const key = outcome.ok ? 'read' : String(outcome.errorId ?? outcome.name);
        tally.set(key, (tally.get(key) ?? 0) + 1);
        if (!outcome.ok) {
          expect(outcome.ifcReadError, `${outcome.name}: ${outcome.message}`).toBe(true);
          expect(outcome.errorId).toMatch(/^ifc\./);
          expect(outcome.message!.length).toBeGreaterThan(10);
        }
        expect(goodAfter, 'reading the good model again in the same thread').toEqual(pool.good);
      }, limitMs * 2 + 60_000);
    }
  });
}

it('registers a fuzz case for every mutation of every file', () => {
  expect(cases).toBeGreaterThanOrEqual(samples.length * Object.keys(MUTATIONS).length);
});

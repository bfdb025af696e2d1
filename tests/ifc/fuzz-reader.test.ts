// Fuzzed IFC at the reader: deterministic mutated copies (seeded) of every corpus file and
// sample — cut short, flipped bytes, a malformed entity line, ENDSEC deleted, a huge string,
// duplicated ids, entity lines deleted, references rewired, random bytes after a header.
// Each read runs in a worker thread with a time limit: it must return a result or throw an
// IfcReadError, never another error, never run past the limit, and never leave the reader
// unable to read a good model correctly afterwards in the same thread.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import { CORPUS_DIR } from './corpus-helpers.ts';

const repoRoot = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');
const GOOD_MODEL = join(repoRoot, 'samples/kestrel-yard-shed.ifc');
const WORKERS = 2;

// ---------- the files ----------
const samples = readdirSync(join(repoRoot, 'samples')).filter((f) => f.endsWith('.ifc')).map((f) => join(repoRoot, 'samples', f));
const corpus = existsSync(CORPUS_DIR) ? readdirSync(CORPUS_DIR).filter((f) => f.endsWith('.ifc')).sort().map((f) => join(CORPUS_DIR, f)) : [];
if (!corpus.length) console.warn(`IFC corpus not found in ${CORPUS_DIR}; only the samples are fuzzed.`);

// ---------- seeded mutations ----------
function prng(seedText: string): () => number {
  let h = 2166136261;
  for (const c of seedText) h = Math.imul(h ^ c.charCodeAt(0), 16777619);
  let s = h >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const pick = <T>(r: () => number, xs: T[]): T => xs[Math.floor(r() * xs.length)];

interface Parsed {
  text: string;
  dataStart: number;
  lines: { start: number; end: number; id: number }[];
}
function parse(bytes: Buffer): Parsed {
  const text = bytes.toString('latin1');
  const dataStart = Math.max(0, text.search(/\nDATA;/));
  const lines: Parsed['lines'] = [];
  const re = /^#(\d+)\s*=.*$/gm;
  re.lastIndex = dataStart;
  for (let m = re.exec(text); m; m = re.exec(text)) lines.push({ start: m.index, end: m.index + m[0].length, id: Number(m[1]) });
  return { text, dataStart, lines };
}
const enc = (s: string) => Buffer.from(s, 'latin1');

type Mutation = (bytes: Buffer, p: Parsed, r: () => number) => Buffer;
const MUTATIONS: Record<string, Mutation> = {
  'cut short': (b, p, r) => b.subarray(0, p.dataStart + Math.floor(r() * (b.length - p.dataStart))),
  'flipped bytes': (b, p, r) => {
    const out = Buffer.from(b);
    for (let i = 0; i < 24; i++) out[p.dataStart + Math.floor(r() * (b.length - p.dataStart))] ^= 1 + Math.floor(r() * 255);
    return out;
  },
  'malformed entity line': (_b, p, r) => {
    const line = pick(r, p.lines);
    const junk = pick(r, [`#${line.id}=IFCBEAM('abc',,$,(#,#1,;`, `#${line.id}=IFCCARTESIANPOINT((0.,0.,'`, `#${line.id}= ;`, `#${line.id}=IFCNOSUCHCLASS(#${line.id});`, `#${line.id}=IFCPROJECT(((((((((((((((((((((((((((((((`]);
    return enc(p.text.slice(0, line.start) + junk + p.text.slice(line.end));
  },
  'ENDSEC deleted': (_b, p) => enc(p.text.replace(/ENDSEC;/g, '')),
  'huge string': (_b, p, r) => {
    const strings = [...p.text.slice(p.dataStart).matchAll(/'[^'\n]{1,80}'/g)];
    const s = strings.length ? pick(r, strings) : null;
    if (!s) return enc(p.text);
    const at = p.dataStart + s.index!;
    return enc(`${p.text.slice(0, at)}'${'A'.repeat(3_000_000)}'${p.text.slice(at + s[0].length)}`);
  },
  'duplicated ids': (_b, p, r) => {
    const extra: string[] = [];
    for (let i = 0; i < 30; i++) {
      const line = pick(r, p.lines);
      extra.push(r() < 0.5 ? p.text.slice(line.start, line.end) : `#${line.id}=IFCCARTESIANPOINT((1.,2.,3.));`);
    }
    const at = p.text.lastIndexOf('ENDSEC;');
    return enc(`${p.text.slice(0, at)}${extra.join('\n')}\n${p.text.slice(at)}`);
  },
  'lines deleted': (_b, p, r) => {
    const drop = new Set(p.lines.filter(() => r() < 0.05));
    let out = '';
    let pos = 0;
    for (const line of drop) {
      out += p.text.slice(pos, line.start);
      pos = line.end;
    }
    return enc(out + p.text.slice(pos));
  },
  'references rewired': (_b, p, r) => {
    const ids = p.lines.map((l) => l.id);
    let n = 0;
    const text = p.text.slice(p.dataStart).replace(/(?<=[(,])#(\d+)/g, (m) => (n++ % 7 === 0 && r() < 0.3 ? `#${pick(r, ids)}` : m));
    return enc(p.text.slice(0, p.dataStart) + text);
  },
  'random bytes after a header': (_b, p, r) => {
    const header = p.text.slice(0, p.dataStart);
    const noise = Buffer.alloc(64 * 1024);
    for (let i = 0; i < noise.length; i++) noise[i] = Math.floor(r() * 256);
    return Buffer.concat([enc(`${header}\nDATA;\n`), noise, enc('\nENDSEC;\nEND-ISO-10303-21;\n')]);
  },
};
/** Large files read slowly: they get the mutations most likely to reach deep into the reader. */
const BIG_FILE_MUTATIONS = ['cut short', 'flipped bytes', 'references rewired'];
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
        const parsed = parse(bytes);
        const mutated = MUTATIONS[kind](bytes, parsed, prng(`${basename(file)}|${kind}`));
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

/**
 * Deterministic (seeded) mutations of IFC files for the fuzz suites: the reader-level suite
 * (tests/ifc/fuzz-reader.test.ts) and the job-level one (tests/api/fuzz-import.test.ts).
 */
export function prng(seedText: string): () => number {
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

export interface Parsed {
  text: string;
  dataStart: number;
  lines: { start: number; end: number; id: number }[];
}
export function parseIfcText(bytes: Buffer): Parsed {
  const text = bytes.toString('latin1');
  const dataStart = Math.max(0, text.search(/\nDATA;/));
  const lines: Parsed['lines'] = [];
  const re = /^#(\d+)\s*=.*$/gm;
  re.lastIndex = dataStart;
  for (let m = re.exec(text); m; m = re.exec(text)) lines.push({ start: m.index, end: m.index + m[0].length, id: Number(m[1]) });
  return { text, dataStart, lines };
}
const enc = (s: string) => Buffer.from(s, 'latin1');

export type Mutation = (bytes: Buffer, p: Parsed, r: () => number) => Buffer;
export const MUTATIONS: Record<string, Mutation> = {
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

/** A mutated copy of `bytes`, the same every run for the same file name and kind. */
export function mutate(bytes: Buffer, fileName: string, kind: string): Buffer {
  return MUTATIONS[kind](bytes, parseIfcText(bytes), prng(`${fileName}|${kind}`));
}

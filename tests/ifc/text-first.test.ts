// A regular file is read text first: classes listed from the text's index, web-ifc opened only
// if a line needs it (server/ifc/read-model.ts, decision 0014). That way must give exactly the
// model, or exactly the error, of web-ifc opening the file first — wherever web-ifc reads the
// text as it is written.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ReadStats } from '../../server/ifc/types.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';
import { MUTATIONS, mutate } from '../support/ifc-mutations.ts';
import { CORPUS_DIR, CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';

const samples = SAMPLE_IFC_FILES;
const corpus = CORPUS_IFC_FILES;
if (!corpus.length) console.warn(`text-first: no corpus at ${CORPUS_DIR}; only the samples and a synthetic model are compared`);

const newStats = (): ReadStats => ({ openMs: 0, extractMs: 0, linesRead: 0, linesFromWebIfc: 0 });

/** The model as JSON, or the error's id: what a read ends with. */
async function outcome(bytes: Uint8Array, webIfcFirst: boolean, stats?: ReadStats): Promise<string> {
  try {
    return JSON.stringify(await readIfcModel(bytes, { webIfcFirst, stats }));
  } catch (e) {
    return `error ${(e as { id?: string }).id ?? (e as Error).message}`;
  }
}

const shed = () => new TextDecoder('latin1').decode(readFileSync(samples.find((f) => f.endsWith('kestrel-yard-shed.ifc'))!));
const latin1 = (text: string) => new Uint8Array(Buffer.from(text, 'latin1'));

describe('reading text first', () => {
  const files: [string, () => Uint8Array | Promise<Uint8Array>][] = [
    ...[...corpus, ...samples].map((f): [string, () => Uint8Array] => [f.split('/').pop()!, () => new Uint8Array(readFileSync(f))]),
    ['synthetic model of 30 members', () => makeSyntheticModel(30)],
  ];
  for (const [name, load] of files) {
    it(`${name}: the same model as web-ifc opening first`, async () => {
      const bytes = await load();
      const textFirst = await outcome(bytes, false);
      expect(textFirst).toBe(await outcome(bytes, true));
      expect(textFirst.startsWith('error')).toBe(false);
    }, 60_000);
  }

  it('never opens web-ifc for the samples and the synthetic model (their text is regular)', async () => {
    for (const bytes of [new Uint8Array(readFileSync(samples[0])), await makeSyntheticModel(30)]) {
      const stats = newStats();
      await readIfcModel(bytes, { stats });
      expect(stats.textReader).toBe(true);
      expect(stats.openMs).toBe(0);
      expect(stats.linesFromWebIfc).toBe(0);
    }
  });

  it('gives the same model from bytes in shared memory (as the import reads them)', async () => {
    for (const bytes of [new Uint8Array(readFileSync(samples[0])), await makeSyntheticModel(30)]) {
      const shared = new Uint8Array(new SharedArrayBuffer(bytes.length));
      shared.set(bytes);
      expect(await outcome(shared, false)).toBe(await outcome(bytes, true));
    }
  });

  it('steps back to web-ifc first when a line it needs web-ifc for is one web-ifc reads differently', async () => {
    // '.5' (no digit before the point) is deferred to web-ifc, whose tokeniser then runs past the
    // end of the statement and loses the next line: web-ifc counts one line fewer than the text.
    const good = shed();
    const damaged = good.replace("IFCFORCEMEASURE(182000.)", 'IFCFORCEMEASURE(.5)');
    expect(damaged).not.toBe(good);
    const bytes = latin1(damaged);
    const stats = newStats();
    expect(await outcome(bytes, false, stats)).toBe(await outcome(bytes, true));
    expect(stats.openMs).toBeGreaterThan(0);
    expect(stats.textReader).toBe(false);
  });

  it('keeps a line web-ifc would lose when the damaged line is never read', async () => {
    // The same damage in a line nothing refers to: read text first, the model keeps the load case
    // written after it, which web-ifc's tokeniser swallows.
    const good = shed();
    const damaged = good.replace(/(\n)(#163=IFCPROPERTYSINGLEVALUE\('LoadCase')/, "$1#999999=IFCPROPERTYSINGLEVALUE('R',$,IFCLENGTHMEASURE(.5),$);\n$2");
    expect(damaged).not.toBe(good);
    const stats = newStats();
    const textFirst = await readIfcModel(latin1(damaged), { stats });
    const webIfcFirst = await readIfcModel(latin1(damaged), { webIfcFirst: true });
    const intact = await readIfcModel(latin1(good));
    expect(stats.openMs).toBe(0);
    expect(textFirst).toEqual(intact);
    expect(webIfcFirst).not.toEqual(intact);
  });

  it('reads web-ifc first when the text cannot list classes exactly (a repeated id)', async () => {
    const good = shed();
    const line = /\n(#(\d+)=IFCPROPERTYSINGLEVALUE\([^\n]*)/.exec(good)!;
    const bytes = latin1(good.replace(line[0], `${line[0]}\n${line[1]}`));
    const stats = newStats();
    expect(await outcome(bytes, false, stats)).toBe(await outcome(bytes, true));
    expect(stats.openMs).toBeGreaterThan(0);
  });

  it('reads web-ifc first when a statement holds a comment', async () => {
    const good = shed();
    const bytes = latin1(good.replace("IFCFORCEMEASURE(182000.)", 'IFCFORCEMEASURE(182000.) /* checked */'));
    const stats = newStats();
    const model = await readIfcModel(bytes, { stats });
    expect(stats.openMs).toBeGreaterThan(0);
    expect(model).toEqual(await readIfcModel(latin1(good)));
  });

  const sample = readFileSync(samples.find((f) => f.endsWith('kestrel-yard-shed.ifc'))!);
  for (const kind of Object.keys(MUTATIONS)) {
    it(`a damaged sample (${kind}): the same model or the same error either way`, async () => {
      const bytes = new Uint8Array(mutate(sample, 'kestrel-yard-shed.ifc', kind));
      expect(await outcome(bytes, false)).toBe(await outcome(bytes, true));
    }, 60_000);
  }
});

// Large files are opened by web-ifc in a thread of its own while the text is read and classes
// are listed from the text's index (server/ifc/read-model.ts, readWhileOpening). That way must
// give exactly the model, or exactly the error, of the usual one (web-ifc opens first, here).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ReadStats } from '../../server/ifc/types.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';
import { MUTATIONS, mutate } from '../support/ifc-mutations.ts';
import { CORPUS_DIR, CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';

const samples = SAMPLE_IFC_FILES;
const corpus = CORPUS_IFC_FILES;
if (!corpus.length) console.warn(`open-in-thread: no corpus at ${CORPUS_DIR}; only the samples and a synthetic model are compared`);

/** The model as JSON, or the error's id: what a read ends with. */
async function outcome(bytes: Uint8Array, openInThread: boolean, stats?: ReadStats): Promise<string> {
  try {
    return JSON.stringify(await readIfcModel(bytes, { openInThread, stats }));
  } catch (e) {
    return `error ${(e as { id?: string }).id ?? (e as Error).message}`;
  }
}

describe('web-ifc opening in its own thread', () => {
  const files: [string, () => Uint8Array | Promise<Uint8Array>][] = [
    ...[...corpus, ...samples].map((f): [string, () => Uint8Array] => [f.split('/').pop()!, () => new Uint8Array(readFileSync(f))]),
    ['synthetic model of 30 members', () => makeSyntheticModel(30)],
  ];
  for (const [name, load] of files) {
    it(`${name}: the same model as opening first`, async () => {
      const bytes = await load();
      const stats = {} as ReadStats;
      const threaded = await outcome(bytes, true, stats);
      expect(threaded).toBe(await outcome(bytes, false));
      expect(threaded.startsWith('error')).toBe(false);
    }, 60_000);
  }

  it('takes the threaded way for the samples and the synthetic model (their classes list from the text)', async () => {
    for (const bytes of [new Uint8Array(readFileSync(samples[0])), await makeSyntheticModel(30)]) {
      const stats = {} as ReadStats;
      await readIfcModel(bytes, { openInThread: true, stats });
      expect(stats.openInThread).toBe(true);
      expect(stats.linesFromWebIfc).toBe(0);
    }
  });

  it('gives the same model from bytes in shared memory (as the import reads them)', async () => {
    for (const bytes of [new Uint8Array(readFileSync(samples[0])), await makeSyntheticModel(30)]) {
      const shared = new Uint8Array(new SharedArrayBuffer(bytes.length));
      shared.set(bytes);
      expect(await outcome(shared, true)).toBe(await outcome(bytes, false));
    }
  });

  it('reads the usual way, with the same result, when web-ifc counts other lines than the text shows', async () => {
    // '.5' (no digit before the point) makes web-ifc lose the next line (see step-text.test.ts).
    const good = new TextDecoder('latin1').decode(readFileSync(samples.find((f) => f.endsWith('kestrel-yard-shed.ifc'))!));
    const damaged = good.replace(/(\n)(#\d+=IFCPROPERTYSINGLEVALUE\('LoadCase')/, "$1#999999=IFCPROPERTYSINGLEVALUE('R',$,IFCLENGTHMEASURE(.5),$);\n$2");
    expect(damaged).not.toBe(good);
    const bytes = new Uint8Array(Buffer.from(damaged, 'latin1'));
    const stats = {} as ReadStats;
    expect(await outcome(bytes, true, stats)).toBe(await outcome(bytes, false));
    expect(stats.openInThread).toBe(false);
    expect(stats.textReader).toBe(false);
  });

  it('reads the usual way when the text cannot list classes exactly (a repeated id)', async () => {
    const good = new TextDecoder('latin1').decode(readFileSync(samples.find((f) => f.endsWith('kestrel-yard-shed.ifc'))!));
    const line = /\n(#(\d+)=IFCPROPERTYSINGLEVALUE\([^\n]*)/.exec(good)!;
    const bytes = new Uint8Array(Buffer.from(good.replace(line[0], `${line[0]}\n${line[1]}`), 'latin1'));
    const stats = {} as ReadStats;
    expect(await outcome(bytes, true, stats)).toBe(await outcome(bytes, false));
    expect(stats.openInThread).toBe(false);
  });

  const sample = readFileSync(samples.find((f) => f.endsWith('kestrel-yard-shed.ifc'))!);
  for (const kind of Object.keys(MUTATIONS)) {
    it(`a damaged sample (${kind}): the same model or the same error either way`, async () => {
      const bytes = new Uint8Array(mutate(sample, 'kestrel-yard-shed.ifc', kind));
      expect(await outcome(bytes, true)).toBe(await outcome(bytes, false));
    }, 60_000);
  }
});

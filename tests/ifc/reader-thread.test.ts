// The reader thread (server/ifc/reader-thread.ts, decision 0014): it indexes the second half of
// the text while the reading thread indexes the first, then reads the bolt groups while members
// are read. Reads with and without it give the same model; an index made in two parts equals one
// made in one scan, also where the split falls badly; the thread is kept for the next file, and
// the reading thread does the work itself when the thread gives up or is gone.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as W from 'web-ifc';
import { type BoltGroupsRequest, readBoltGroups } from '../../server/ifc/bolt-groups-read.ts';
import { getIfcApi } from '../../server/ifc/ifc-api.ts';
import { askReaderThread, idleReaderThreads, shareable } from '../../server/ifc/reader-thread.ts';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import { StepText } from '../../server/ifc/step-text.ts';
import type { ReadStats } from '../../server/ifc/types.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';
import { CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';

const newStats = (): ReadStats => ({ openMs: 0, extractMs: 0, linesRead: 0, linesFromWebIfc: 0 });
const withBolts = (f: string) => /steel|frame|bolt|kestrel|shed/i.test(f);
const codeOf = async () => {
  const api = await getIfcApi();
  return (name: string) => api.GetTypeCodeFromName(name);
};

/** What the reading thread hands the reader thread for bolt groups: shared bytes and its index (regular IFC4 text). */
async function boltRequestFor(plain: Uint8Array): Promise<BoltGroupsRequest> {
  const bytes = shareable(plain);
  const index = StepText.index(bytes, await codeOf()).snapshot();
  if (!index) throw new Error('irregular text');
  return { bytes, index, schema: 'IFC4', schemaIdentifier: 'IFC4' };
}

/** Everything the index answers that a read uses: lists of the classes asked for, raw lines, size and regularity. */
function indexView(t: StepText, ids: number) {
  const codes = [W.IFCMECHANICALFASTENER, W.IFCMEMBER, W.IFCRELDEFINESBYPROPERTIES, W.IFCPROJECT, W.IFCPROPERTYSINGLEVALUE, W.IFCCARTESIANPOINT];
  const raw: unknown[] = [];
  for (let id = 1; id <= ids; id += 3) raw.push(t.raw(id));
  return { size: t.size, regular: t.regular, exact: t.listsExact, lists: codes.map((c) => t.idsOfType(c)), raw };
}

describe('the reader thread', () => {
  const files: [string, () => Uint8Array | Promise<Uint8Array>][] = [
    ...[...CORPUS_IFC_FILES.filter(withBolts), ...SAMPLE_IFC_FILES].map((f): [string, () => Uint8Array] => [f.split('/').pop()!, () => new Uint8Array(readFileSync(f))]),
    ['synthetic model of 60 members', () => makeSyntheticModel(60)],
  ];
  for (const [name, load] of files) {
    it(`${name}: the same model with and without it, warnings and counts included`, async () => {
      const bytes = await load();
      expect(await readIfcModel(bytes, { readerThread: true })).toEqual(await readIfcModel(bytes, { readerThread: false }));
    }, 60_000);
  }

  it('indexes a text in two parts as one scan does', async () => {
    const bytes = shareable(await makeSyntheticModel(40));
    const f = await codeOf();
    const split = StepText.splitPoint(bytes)!;
    expect(split).toBeGreaterThan(bytes.length / 2);
    const parts = StepText.indexUpTo(bytes, split, f);
    parts.finishFrom(StepText.indexRest(bytes, split, f));
    const whole = StepText.index(bytes, f);
    expect(indexView(parts, whole.size)).toEqual(indexView(whole, whole.size));
    expect(parts.regular).toBe(true);
    // The thread's part, handed over as the read gets it.
    const viaThread = StepText.indexUpTo(bytes, split, f);
    const rest = await askReaderThread({ kind: 'index-rest', bytes, from: split }).answer;
    expect(rest.ok).toBe(true);
    viaThread.finishFrom(rest.ok ? rest.rest : null);
    expect(indexView(viaThread, whole.size)).toEqual(indexView(whole, whole.size));
    // Lines ending in \r\n split as well.
    const crlf = shareable(new Uint8Array(Buffer.from(Buffer.from(bytes).toString('latin1').replace(/\n/g, '\r\n'), 'latin1')));
    const at = StepText.splitPoint(crlf)!;
    expect(Buffer.from(crlf.subarray(at - 3, at + 1)).toString('latin1')).toBe(';\r\n#');
    const crlfParts = StepText.indexUpTo(crlf, at, f);
    crlfParts.finishFrom(StepText.indexRest(crlf, at, f));
    const crlfWhole = StepText.index(crlf, f);
    expect(indexView(crlfParts, crlfWhole.size)).toEqual(indexView(crlfWhole, crlfWhole.size));
  });

  it('scans the rest itself when the split falls inside a string, and sees an id repeated across the parts', async () => {
    const f = await codeOf();
    const good = new TextDecoder('latin1').decode(await makeSyntheticModel(40));
    // A string holding ";\n#" that spans the middle of the file: the guessed split lies inside it.
    const lineStart = good.indexOf('\n#', good.length >> 1) + 1;
    const long = `#999999=IFCPROPERTYSINGLEVALUE('${'x'.repeat(good.length)};\n#odd',$,$,$);\n`;
    const tricky = shareable(new Uint8Array(Buffer.from(good.slice(0, lineStart) + long + good.slice(lineStart), 'latin1')));
    const split = StepText.splitPoint(tricky)!;
    expect(Buffer.from(tricky.subarray(split, split + 4)).toString('latin1')).toBe('#odd');
    const parts = StepText.indexUpTo(tricky, split, f);
    parts.finishFrom(StepText.indexRest(tricky, split, f));
    const whole = StepText.index(tricky, f);
    expect(whole.idsOfType(W.IFCPROPERTYSINGLEVALUE)).toContain(999999);
    expect(indexView(parts, whole.size)).toEqual(indexView(whole, whole.size));
    // An id written in both halves: not regular, whichever way it was indexed.
    const first = /\n(#(\d+)=IFCPROPERTYSINGLEVALUE\([^\n]*)/.exec(good)!;
    const twice = shareable(new Uint8Array(Buffer.from(`${good.replace(/END-ISO-10303-21;\s*$/, '').replace(/ENDSEC;\s*$/, '')}${first[1]}\nENDSEC;\nEND-ISO-10303-21;\n`, 'latin1')));
    const s2 = StepText.splitPoint(twice)!;
    const parts2 = StepText.indexUpTo(twice, s2, f);
    parts2.finishFrom(StepText.indexRest(twice, s2, f));
    const whole2 = StepText.index(twice, f);
    expect(whole2.regular).toBe(false);
    expect(indexView(parts2, whole2.size)).toEqual(indexView(whole2, whole2.size));
  });

  it('finds the synthetic model\'s bolt groups (two per member), and the read takes every line from the text', async () => {
    const bytes = await makeSyntheticModel(30);
    const answer = await askReaderThread({ kind: 'bolt-groups', ...(await boltRequestFor(bytes)) }).answer;
    expect(answer.ok).toBe(true);
    if (answer.ok) expect(answer.bolts.length).toBe(60);
    const stats = newStats();
    await readIfcModel(bytes, { readerThread: true, stats });
    expect(stats.linesFromWebIfc).toBe(0);
  });

  it('keeps the thread for the next file, and ends one that is stopped', async () => {
    const request = { kind: 'bolt-groups' as const, ...(await boltRequestFor(await makeSyntheticModel(10))) };
    await askReaderThread(request).answer;
    const idle = idleReaderThreads();
    expect(idle).toBeGreaterThan(0);
    await askReaderThread(request).answer;
    expect(idleReaderThreads()).toBe(idle);
    const stopped = askReaderThread(request);
    stopped.stop();
    expect((await stopped.answer).ok).toBe(false);
    expect(idleReaderThreads()).toBe(idle - 1);
  });

  it('an adopted index reads what the scanned one reads; irregular text gives none to adopt', async () => {
    const f = await codeOf();
    const bytes = await makeSyntheticModel(5);
    const scanned = StepText.index(bytes, f);
    const adopted = StepText.adopt(bytes, scanned.snapshot()!, f);
    expect(indexView(adopted, scanned.size)).toEqual(indexView(scanned, scanned.size));
    expect(adopted.idsOfType(W.IFCMECHANICALFASTENER).length).toBeGreaterThan(0);
    const good = new TextDecoder('latin1').decode(bytes);
    const commented = new TextEncoder().encode(good.replace(/IFCMECHANICALFASTENER\(/, 'IFCMECHANICALFASTENER(/* c */'));
    expect(StepText.index(commented, f).snapshot()).toBeNull();
  });

  it('gives up the bolt groups of a file without a project', async () => {
    const good = new TextDecoder('latin1').decode(await makeSyntheticModel(5));
    const noProject = new TextEncoder().encode(good.replace(/#(\d+)=IFCPROJECT\([^\n]*\n/, ''));
    expect(await readBoltGroups(await boltRequestFor(noProject))).toMatchObject({ ok: false, message: 'no project' });
  });

  it('the reading thread reads the bolt groups itself when the thread gives up', async () => {
    // A line the text cannot read exactly (an escaped name) makes the thread give up; the read is the same.
    const good = new TextDecoder('latin1').decode(await makeSyntheticModel(20));
    const escaped = good.replace(/(IFCMECHANICALFASTENER\('[^']*',#\d+,)'[^']*'/, "$1'Bolt \\X\\E9'");
    expect(escaped).not.toBe(good);
    const bytes = new Uint8Array(Buffer.from(escaped, 'latin1'));
    expect(await readBoltGroups(await boltRequestFor(bytes))).toMatchObject({ ok: false, message: 'a line needs web-ifc' });
    expect(await readIfcModel(bytes, { readerThread: true })).toEqual(await readIfcModel(bytes, { readerThread: false }));
  });
});

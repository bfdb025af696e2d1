// Bolt groups read in a thread of their own while members are read (server/ifc/bolt-thread.ts,
// bolt-groups-read.ts, decision 0014): the same model as reading them after the members, the
// thread kept for the next file, and the reading thread reading them itself when the thread
// gives up or is gone.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import * as W from 'web-ifc';
import { type BoltGroupsRequest, readBoltGroups } from '../../server/ifc/bolt-groups-read.ts';
import { getIfcApi } from '../../server/ifc/ifc-api.ts';
import { StepText } from '../../server/ifc/step-text.ts';
import { idleBoltThreads, readBoltGroupsInThread } from '../../server/ifc/bolt-thread.ts';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ReadStats } from '../../server/ifc/types.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';
import { CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';

const newStats = (): ReadStats => ({ openMs: 0, extractMs: 0, linesRead: 0, linesFromWebIfc: 0 });
/** What the reading thread hands the bolt thread: the bytes and its index of them (regular IFC4 text). */
async function requestFor(bytes: Uint8Array): Promise<BoltGroupsRequest> {
  const api = await getIfcApi();
  const index = StepText.index(bytes, (name) => api.GetTypeCodeFromName(name)).snapshot();
  if (!index) throw new Error('irregular text');
  return { bytes, index, schema: 'IFC4', schemaIdentifier: 'IFC4' };
}

const withBolts = (f: string) => /steel|frame|bolt|kestrel|shed/i.test(f);

describe('bolt groups read in a thread of their own', () => {
  const files: [string, () => Uint8Array | Promise<Uint8Array>][] = [
    ...[...CORPUS_IFC_FILES.filter(withBolts), ...SAMPLE_IFC_FILES].map((f): [string, () => Uint8Array] => [f.split('/').pop()!, () => new Uint8Array(readFileSync(f))]),
    ['synthetic model of 60 members', () => makeSyntheticModel(60)],
  ];
  for (const [name, load] of files) {
    it(`${name}: the same model as reading them after the members, warnings and counts included`, async () => {
      const bytes = await load();
      const threaded = await readIfcModel(bytes, { boltsInThread: true });
      const serial = await readIfcModel(bytes, { boltsInThread: false });
      expect(threaded).toEqual(serial);
    }, 60_000);
  }

  it('finds the synthetic model\'s bolt groups in the thread (two per member)', async () => {
    const bytes = await makeSyntheticModel(30);
    const answer = await readBoltGroupsInThread(await requestFor(bytes)).answer;
    expect(answer.ok).toBe(true);
    if (answer.ok) expect(answer.bolts.length).toBe(60);
    // Read with the thread, the model's lines still all come from the text.
    const stats = newStats();
    await readIfcModel(bytes, { boltsInThread: true, stats });
    expect(stats.linesFromWebIfc).toBe(0);
  });

  it('keeps the thread for the next file, and ends one that is stopped', async () => {
    const bytes = await makeSyntheticModel(10);
    const request = await requestFor(bytes);
    await readBoltGroupsInThread(request).answer;
    const idle = idleBoltThreads();
    expect(idle).toBeGreaterThan(0);
    await readBoltGroupsInThread(request).answer;
    expect(idleBoltThreads()).toBe(idle);
    const stopped = readBoltGroupsInThread(request);
    stopped.stop();
    expect((await stopped.answer).ok).toBe(false);
    expect(idleBoltThreads()).toBe(idle - 1);
  });

  it('an adopted index reads what the scanned one reads; irregular text gives none to adopt', async () => {
    const api = await getIfcApi();
    const codeOf = (name: string) => api.GetTypeCodeFromName(name);
    const bytes = await makeSyntheticModel(5);
    const scanned = StepText.index(bytes, codeOf);
    const adopted = StepText.adopt(bytes, scanned.snapshot()!, codeOf);
    expect(adopted.size).toBe(scanned.size);
    expect(adopted.regular).toBe(true);
    for (const code of [W.IFCMECHANICALFASTENER, W.IFCMEMBER, W.IFCRELDEFINESBYPROPERTIES, W.IFCPROJECT]) {
      expect(adopted.idsOfType(code)).toEqual(scanned.idsOfType(code));
      expect(adopted.idsOfType(code).length).toBeGreaterThan(0);
    }
    for (let id = 1; id <= scanned.size; id += 7) expect(adopted.raw(id)).toEqual(scanned.raw(id));
    const good = new TextDecoder('latin1').decode(bytes);
    const commented = new TextEncoder().encode(good.replace(/IFCMECHANICALFASTENER\(/, 'IFCMECHANICALFASTENER(/* c */'));
    expect(StepText.index(commented, codeOf).snapshot()).toBeNull();
  });

  it('gives up on a file without a project', async () => {
    const good = new TextDecoder('latin1').decode(await makeSyntheticModel(5));
    const noProject = new TextEncoder().encode(good.replace(/#(\d+)=IFCPROJECT\([^\n]*\n/, ''));
    expect(await readBoltGroups(await requestFor(noProject))).toMatchObject({ ok: false, message: 'no project' });
  });

  it('the reading thread reads the bolt groups itself when the thread gives up', async () => {
    // A line the text cannot read exactly (an escaped name) makes the thread give up; the read is the same.
    const good = new TextDecoder('latin1').decode(await makeSyntheticModel(20));
    const escaped = good.replace(/(IFCMECHANICALFASTENER\('[^']*',#\d+,)'[^']*'/, "$1'Bolt \\X\\E9'");
    expect(escaped).not.toBe(good);
    const bytes = new Uint8Array(Buffer.from(escaped, 'latin1'));
    const answer = await readBoltGroups(await requestFor(bytes));
    expect(answer).toMatchObject({ ok: false, message: 'a line needs web-ifc' });
    expect(await readIfcModel(bytes, { boltsInThread: true })).toEqual(await readIfcModel(bytes, { boltsInThread: false }));
  });
});

// Worker thread for the reader fuzz tests: reads the bytes it is sent with readIfcModel and
// reports either a short summary or the error's class and id. After every read it reads a
// known-good model again in the same thread, so a read that leaves web-ifc in a bad state
// shows up as a different answer for the good model.
import { parentPort, workerData } from 'node:worker_threads';
import { readFileSync } from 'node:fs';
import { register } from 'tsx/esm/api';

register();
const { readIfcModel } = await import('../../../server/ifc/read-model.ts');
const { IfcReadError } = await import('../../../server/ifc/ifc-errors.ts');
const good = new Uint8Array(readFileSync(workerData.goodModel));

const summary = (m) => ({ members: m.members.length, bolts: m.boltGroups.length, analysis: m.analysisMembers.length, warnings: m.warnings.map((w) => w.code).sort() });

parentPort.on('message', async ({ id, bytes }) => {
  const started = Date.now();
  let outcome;
  try {
    outcome = { ok: true, summary: summary(await readIfcModel(bytes)) };
  } catch (e) {
    outcome = {
      ok: false,
      ifcReadError: e instanceof IfcReadError,
      errorId: e?.id ?? null,
      name: e?.constructor?.name ?? typeof e,
      message: String(e?.message ?? e).slice(0, 300),
    };
  }
  const ms = Date.now() - started;
  let after;
  try {
    after = summary(await readIfcModel(good));
  } catch (e) {
    after = { error: String(e?.message ?? e) };
  }
  parentPort.postMessage({ id, ms, outcome, goodAfter: after });
});
parentPort.postMessage({ ready: true, good: summary(await readIfcModel(good)) });

// A thread in which web-ifc opens a model and counts its lines, while the thread that asked
// reads the same file's text (read-model.ts, open-check.ts). Plain JavaScript that needs nothing
// but web-ifc, so it starts without the TypeScript loader. It stays for the next file: loading
// web-ifc's code anew cost about half a second of CPU per file. Each file gets a web-ifc instance
// of its own, dropped and collected once answered, so its wasm memory (which never shrinks while
// the instance lives) does not stay with the thread.
import { parentPort } from 'node:worker_threads';
import v8 from 'node:v8';
import vm from 'node:vm';
import { IfcAPI, LogLevel } from 'web-ifc';

v8.setFlagsFromString('--expose-gc');
const collect = vm.runInNewContext('gc');
// Whether the last file's web-ifc instance is still in memory: objects it handed out keep it
// until their own finalisers have run, which takes a collection or two more (two after the
// 154 MB benchmark model; without them the thread kept about 300 MB between files).
let alive = false;
const gone = new FinalizationRegistry(() => {
  alive = false;
});

/** @param {Uint8Array} bytes @returns {Promise<{ ok: true, lines: number, schemaIndex: number } | { ok: false, message: string }>} */
async function check(bytes) {
  try {
    const api = new IfcAPI();
    gone.register(api, undefined);
    alive = true;
    await api.Init(undefined, true);
    api.SetLogLevel(LogLevel.LOG_LEVEL_OFF);
    // The same call and settings as open-model.ts.
    const modelID = api.OpenModel(bytes, { COORDINATE_TO_ORIGIN: false });
    if (modelID === -1 || modelID === undefined) return { ok: false, message: 'web-ifc could not open the file' };
    let lines = -1;
    try {
      lines = api.GetAllLines(modelID).size();
    } catch {
      lines = -1;
    }
    const schemaIndex = api.modelSchemaList?.[modelID] ?? -1;
    return { ok: true, lines, schemaIndex };
  } catch (e) {
    return { ok: false, message: e instanceof Error ? e.message : String(e) };
  }
}

parentPort.on('message', async (message) => {
  const answer = await check(message.bytes);
  // Nothing here may hold the file or the instance while collecting: the file's memory is
  // shared with the reading thread, and goes once neither holds it.
  message.bytes = null;
  for (let round = 0; alive && round < 16; round++) {
    collect();
    await new Promise((r) => setImmediate(r));
  }
  parentPort.postMessage(answer);
});

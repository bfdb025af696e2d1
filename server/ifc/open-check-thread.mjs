// A short-lived thread in which web-ifc opens a model and counts its lines, while the thread
// that started it reads the same file's text (read-model.ts, open-check.ts). Plain JavaScript
// that needs nothing but web-ifc, so it starts without the TypeScript loader. It answers once
// and ends; its wasm memory goes with it.
import { parentPort, workerData } from 'node:worker_threads';
import { IfcAPI, LogLevel } from 'web-ifc';

/** @type {{ bytes: Uint8Array }} */
const { bytes } = workerData;
/** @type {{ ok: true, lines: number, schemaIndex: number } | { ok: false, message: string }} */
let answer;
try {
  const api = new IfcAPI();
  await api.Init(undefined, true);
  api.SetLogLevel(LogLevel.LOG_LEVEL_OFF);
  // The same call and settings as open-model.ts.
  const modelID = api.OpenModel(bytes, { COORDINATE_TO_ORIGIN: false });
  if (modelID === -1 || modelID === undefined) answer = { ok: false, message: 'web-ifc could not open the file' };
  else {
    let lines = -1;
    try {
      lines = api.GetAllLines(modelID).size();
    } catch {
      lines = -1;
    }
    const schemaIndex = api.modelSchemaList?.[modelID] ?? -1;
    answer = { ok: true, lines, schemaIndex };
  }
} catch (e) {
  answer = { ok: false, message: e instanceof Error ? e.message : String(e) };
}
parentPort.postMessage(answer);

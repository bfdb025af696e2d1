// The reader thread: indexes the second part of a file's text while the thread that asked
// indexes the first, then reads the file's bolt groups while that thread reads members
// (reader-thread.ts, step-text.ts, bolt-groups-read.ts). Threads do not inherit the TypeScript
// loader when started from a test runner, so register tsx here. It stays for the next file:
// loading the reader and web-ifc's code anew costs about half a second of CPU.
import v8 from 'node:v8';
import vm from 'node:vm';
import { parentPort } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { answer } = await import('./reader-thread-tasks.ts');

v8.setFlagsFromString('--expose-gc');
const collect = vm.runInNewContext('gc');
/** Idle this long after answering, the thread collects: an idle thread allocates nothing, so V8 would keep the file's index and groups. */
const COLLECT_AFTER_IDLE_MS = 1500;
let idleTimer = null;

parentPort.on('message', async (message) => {
  if (idleTimer) clearTimeout(idleTimer);
  const { reply, transfer } = await answer(message);
  // The file's memory is shared with the reading thread; nothing here may keep it.
  message.bytes = null;
  parentPort.postMessage(reply, transfer);
  // Not at once: the reading thread is still at work on the same cores.
  idleTimer = setTimeout(() => collect(), COLLECT_AFTER_IDLE_MS);
  idleTimer.unref();
});

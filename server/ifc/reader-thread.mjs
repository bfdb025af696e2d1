// The reader thread: indexes the second part of a file's text while the thread that asked
// indexes the first, then reads the file's bolt groups while that thread reads members
// (reader-thread.ts, step-text.ts, bolt-groups-read.ts). Threads do not inherit the TypeScript
// loader when started from a test runner, so register tsx here. It stays for the next file:
// loading the reader and web-ifc's code anew costs about half a second of CPU.
import { parentPort } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { answer } = await import('./reader-thread-tasks.ts');

parentPort.on('message', async (message) => {
  const { reply, transfer } = await answer(message);
  // The file's memory is shared with the reading thread; nothing here may keep it.
  message.bytes = null;
  parentPort.postMessage(reply, transfer);
});

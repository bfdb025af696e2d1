// A thread that reads a file's bolt groups while the thread that asked reads its members
// (bolt-thread.ts, bolt-groups-read.ts). Threads do not inherit the TypeScript loader when
// started from a test runner, so register tsx here. It stays for the next file: loading the
// reader and web-ifc's code anew costs about half a second of CPU.
import { parentPort } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { readBoltGroups } = await import('./bolt-groups-read.ts');

parentPort.on('message', async (message) => {
  const answer = await readBoltGroups(message);
  // The file's memory is shared with the reading thread; nothing here may keep it.
  message.bytes = null;
  parentPort.postMessage(answer);
});

// Entry file of the import worker threads. Workers do not inherit the TypeScript loader
// when the pool is created from a test runner, so register tsx here, then load the tasks.
import { register } from 'tsx/esm/api';
import v8 from 'node:v8';
import { resourceLimits } from 'node:worker_threads';
import { workerData } from 'piscina';

register();
const importTask = import('./run-import-task.ts');
const importForStore = import('./streamed-import-task.ts');
const geometryTask = import('./run-geometry-task.ts');
// In the large-file pool (import-pools.ts) the reader thread loads while this one waits for its first
// job (read-model.ts uses it from 64 MB up; should loading fail here, the first large read starts one,
// or reads alone). Other threads (small files, the command line) start one only if a read asks for it.
if (workerData?.pool === 'large-files') void import('../ifc/reader-thread.ts').then((m) => m.prewarmReaderThread(), () => undefined);

export default async function importWorker(task) {
  // What this thread runs with and holds (tests of the pools, memory probes): its V8 limits and
  // heap, and reader threads kept ready.
  if (task.job === 'thread-state') return { resourceLimits, heap: v8.getHeapStatistics(), idleReaderThreads: (await import('../ifc/reader-thread.ts')).idleReaderThreads() };
  if (task.job === 'geometry') return (await geometryTask).runGeometryTask(task);
  // The app's runner takes members ready to store; the command line takes them as objects.
  if (task.job === 'import-for-store') return (await importForStore).runImportTaskForStore(task);
  return (await importTask).runImportTask(task);
}

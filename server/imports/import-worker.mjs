// Entry file of the import worker threads. Workers do not inherit the TypeScript loader
// when the pool is created from a test runner, so register tsx here, then load the tasks.
import { register } from 'tsx/esm/api';

register();
const importTask = import('./run-import-task.ts');
const importForStore = import('./streamed-import-task.ts');
const geometryTask = import('./run-geometry-task.ts');
// The reader thread loads while this one waits for its first job (read-model.ts uses it from 16 MB up;
// should loading fail here, the first large read starts one, or reads alone).
void import('../ifc/reader-thread.ts').then((m) => m.prewarmReaderThread(), () => undefined);

export default async function importWorker(task) {
  if (task.job === 'geometry') return (await geometryTask).runGeometryTask(task);
  // The app's runner takes members ready to store; the command line takes them as objects.
  if (task.job === 'import-for-store') return (await importForStore).runImportTaskForStore(task);
  return (await importTask).runImportTask(task);
}

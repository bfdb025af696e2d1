// Entry file of the import worker threads. Workers do not inherit the TypeScript loader
// when the pool is created from a test runner, so register tsx here, then load the task.
import { register } from 'tsx/esm/api';

register();
const loaded = import('./run-import-task.ts');

export default async function importWorker(task) {
  const { runImportTask } = await loaded;
  return runImportTask(task);
}

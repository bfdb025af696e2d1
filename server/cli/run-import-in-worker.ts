/**
 * Runs the server's import task (read → forces → checks) in a worker thread, through the
 * same worker entry the server uses, with a time limit: a malformed model can make the
 * IFC parser loop forever, and a command line must always come back.
 */
import Piscina from 'piscina';
import type { ImportOutcome, ImportTask } from '../imports/run-import-task.ts';
import { CliInputError } from './cli-error.ts';

export async function runImportInWorker(task: ImportTask, timeLimitSeconds: number, label: string): Promise<ImportOutcome> {
  const pool = new Piscina({
    filename: new URL('../imports/import-worker.mjs', import.meta.url).href,
    minThreads: 1,
    maxThreads: 1,
  });
  try {
    return (await pool.run(task, { signal: AbortSignal.timeout(Math.round(timeLimitSeconds * 1000)) })) as ImportOutcome;
  } catch (e) {
    const name = (e as Error)?.name;
    if (name === 'AbortError' || name === 'TimeoutError') {
      throw new CliInputError(`${label}: reading and checking took longer than the ${timeLimitSeconds} s time limit (raise it with --time-limit)`);
    }
    throw e;
  } finally {
    await pool.destroy();
  }
}

/**
 * Child-process entry for the benchmarks: the real app via startServer, configured by the
 * environment. Sends { url } when listening; answers { memory } with process.memoryUsage();
 * stops cleanly on { stop }.
 */
import { startServer } from '../../../server/index.ts';

try {
  const running = await startServer(process.env, true);
  process.send?.({ url: running.url });
  process.on('message', (m: { stop?: boolean; memory?: boolean }) => {
    if (m.memory) process.send?.({ memory: process.memoryUsage() });
    if (m.stop) {
      void running.stop().finally(() => process.exit(0));
    }
  });
  process.on('disconnect', () => void running.stop().finally(() => process.exit(0)));
} catch (err) {
  process.send?.({ error: err instanceof Error ? err.message : String(err) });
  process.exit(1);
}

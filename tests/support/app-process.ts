// Runs one Gaugeline app in a process of its own (a second "machine" for tests that need
// several app processes sharing a database). Prints {"url": "..."} once listening;
// stops cleanly on SIGTERM. Sequelize models are per process, so apps that must not
// share state cannot run in the test's own process.
import { startServer } from '../../server/index';

const server = await startServer(process.env, true);
process.stdout.write(`${JSON.stringify({ url: server.url, owner: server.imports.owner })}\n`);
const stop = async () => {
  await server.stop().catch(() => undefined);
  process.exit(0);
};
process.on('SIGTERM', () => void stop());
process.on('SIGINT', () => void stop());

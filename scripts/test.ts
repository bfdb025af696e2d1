// npm test (after scripts/test.sh installed what was missing): lint, type-check, then every
// vitest suite (unit, ifc, api, e2e) against a throwaway MariaDB on a free port.
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startMariaInstance, ensureDatabase } from './db/mariadb-instance';
import { buildClientIfStale } from './lib/build-client';
import { freePort } from './lib/free-port';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);


function step(title: string, command: string, args: string[], env: NodeJS.ProcessEnv = process.env): number {
  console.log(`\n== ${title}`);
  const started = Date.now();
  const result = spawnSync(command, args, { stdio: 'inherit', env, cwd: root });
  console.log(`== ${title}: ${result.status === 0 ? 'ok' : 'FAILED'} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return result.status ?? 1;
}

async function main(): Promise<number> {
  const vitestArgs = process.argv.slice(2);
  const node = process.execPath;
  if (!vitestArgs.length) {
    if (step('lint', node, ['node_modules/eslint/bin/eslint.js', '.', '--max-warnings=0']) !== 0) return 1;
    if (step('type-check', node, ['node_modules/typescript/bin/tsc', '-p', 'tsconfig.json', '--noEmit']) !== 0) return 1;
  }
  buildClientIfStale(root);

  const dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-test-'));
  const port = await freePort();
  const db = await startMariaInstance({ dir, port, quiet: true });
  const password = randomBytes(12).toString('base64url');
  // The test user may create databases: every API/e2e test file works in a database of its own.
  await ensureDatabase(db, { name: 'gaugeline_test', user: 'gaugeline_test', password, global: true });
  console.log(`\nThrowaway MariaDB on 127.0.0.1:${port} (${dir})`);
  const report = path.join(dir, 'vitest-report.json');
  try {
    const code = step('tests', node, ['node_modules/vitest/vitest.mjs', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...vitestArgs], {
      ...process.env,
      TEST_DB_HOST: '127.0.0.1',
      TEST_DB_PORT: String(port),
      TEST_DB_USER: 'gaugeline_test',
      TEST_DB_PASSWORD: password,
      TEST_DB_SOCKET: db.socket,
    });
    printClosingLine(report);
    return code;
  } finally {
    await db.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

/** One plain closing line that any CI log reader understands. */
function printClosingLine(reportPath: string): void {
  if (!existsSync(reportPath)) return;
  const r = JSON.parse(readFileSync(reportPath, 'utf8')) as { numPassedTests: number; numFailedTests: number; numPendingTests: number; numTodoTests: number };
  const skipped = r.numPendingTests + r.numTodoTests;
  console.log(`\ngaugeline: ${r.numPassedTests} passed, ${r.numFailedTests} failed${skipped ? `, ${skipped} skipped` : ''}`);
}

main().then(
  (code) => process.exit(code),
  (err) => {
    console.error(err instanceof Error ? err.stack : err);
    process.exit(1);
  },
);

// 3D view at scale: a synthetic model of N members (default 20,000) goes through the real
// pipeline — display geometry build, import through the app (throwaway MariaDB), then the
// revision page in headless Chromium — and prints the geometry file size, its build time,
// the draw calls and the time to the first coloured frame.
//
//   node --import tsx scripts/bench/viewer.ts [members]
//
// Targets: fewer than 100 draw calls, first coloured frame under 5 s.
import { existsSync, mkdtempSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { freePort } from '../lib/free-port';
import os from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { makeSyntheticModel } from '../samples/make-samples';
import { buildDisplayGeometry } from '../../server/ifc/display-geometry';
import { startMariaInstance, ensureDatabase } from '../db/mariadb-instance';
import { buildClientIfStale } from '../lib/build-client';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const N = Number(process.argv[2] ?? 20_000);
/** Writing the model uses web-ifc too; a separate process leaves this one's wasm heap fresh. Kept in the temp folder for the next run. */
const IFC_CACHE = path.join(os.tmpdir(), `gaugeline-synthetic-${N}.ifc`);
const PASSWORD = 'gaugeline-demo';

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;
const secs = (ms: number) => `${(ms / 1000).toFixed(1)} s`;

async function writeModel(): Promise<void> {
  const bytes = await makeSyntheticModel(N);
  writeFileSync(`${IFC_CACHE}.partial`, bytes);
  renameSync(`${IFC_CACHE}.partial`, IFC_CACHE);
}

async function main(): Promise<void> {
  let t = performance.now();
  if (!existsSync(IFC_CACHE)) {
    execFileSync(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), String(N), '--write-model'], { stdio: 'inherit' });
    console.log(`synthetic model: ${N} members written in ${secs(performance.now() - t)}`);
  }
  const ifc = new Uint8Array(readFileSync(IFC_CACHE));
  console.log(`synthetic model: ${N} members, ${mb(ifc.length)} IFC (${IFC_CACHE})`);

  t = performance.now();
  const built = await buildDisplayGeometry(ifc);
  const steel = built.stats.withGeometry - built.stats.contextElements;
  console.log(
    `display geometry: ${built.stats.withGeometry} elements (${steel} steel), ${built.stats.vertices} vertices, ${built.stats.triangles} triangles, ` +
      `${mb(built.bytes.length)} = ${Math.round(built.bytes.length / N)} B per member (${Math.round(built.bytes.length / built.stats.withGeometry)} B per element), built in ${secs(performance.now() - t)}, RSS ${mb(process.memoryUsage().rss)}`,
  );

  buildClientIfStale(root);
  const dir = mkdtempSync(path.join(os.tmpdir(), 'gaugeline-bench-viewer-'));
  const db = await startMariaInstance({ dir, port: await freePort(), quiet: true });
  const password = randomBytes(12).toString('base64url');
  await ensureDatabase(db, { name: 'gaugeline_bench', user: 'gaugeline_bench', password, global: true });
  Object.assign(process.env, { TEST_DB_HOST: '127.0.0.1', TEST_DB_PORT: String(db.port), TEST_DB_USER: 'gaugeline_bench', TEST_DB_PASSWORD: password, TEST_DB_SOCKET: db.socket });
  const { startTestApp } = await import('../../tests/support/test-app');
  const { signIn, DEMO } = await import('../../tests/support/api-client');
  const { waitFor } = await import('../../tests/support/wait-for');
  const { launchBrowser } = await import('../../tests/support/browser');
  const app = await startTestApp({ IMPORT_POLL_MS: '100', UPLOAD_LIMIT_MB: '2000', IMPORT_TIME_LIMIT_SECONDS: '1800' });
  const browser = await launchBrowser();
  try {
    const engineer = await signIn(app.url, DEMO.engineer);
    const projectId = (await engineer.call('get', '/api/projects')).body.projects[0].id;
    t = performance.now();
    const up = await engineer.agent.post(`/api/projects/${projectId}/uploads`).set('X-CSRF-Token', engineer.csrf).attach('file', Buffer.from(ifc), `synthetic-${N}.ifc`);
    if (up.status !== 201) throw new Error(`upload: ${up.status} ${JSON.stringify(up.body)}`);
    const revisionId = up.body.revision.id;
    const done = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}`), (r) => ['done', 'failed'].includes(r.body.status), 1_800_000, 1000);
    if (done.body.status !== 'done') throw new Error(`import: ${JSON.stringify(done.body)}`);
    console.log(`import through the app: ${secs(performance.now() - t)} (timings ${JSON.stringify(done.body.summary?.timings)})`);
    // The display geometry is built after the results are stored; the view is measured once it is ready.
    t = performance.now();
    const ready = await waitFor(() => engineer.call('get', `/api/projects/${projectId}/revisions/${revisionId}`), (r) => r.body.summary?.geometry !== 'pending', 3_600_000, 1000);
    if (ready.body.summary?.geometry !== 'ready') throw new Error(`display geometry: ${JSON.stringify(ready.body.summary?.geometry)}`);
    console.log(`3D view ready ${secs(performance.now() - t)} after the results`);

    const context = await browser.newContext({ baseURL: app.url, viewport: { width: 1400, height: 1000 } });
    const page = await context.newPage();
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(e.message));
    await page.goto('/sign-in');
    const form = page.getByRole('form', { name: 'Sign in' });
    await form.getByLabel('E-mail address').fill(DEMO.viewer);
    await form.getByLabel('Password', { exact: true }).fill(PASSWORD);
    await form.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { level: 1, name: 'Projects' }).waitFor();
    // Bytes on the wire per request (after any compression), from the browser's network events.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    const requests = new Map<string, string>();
    const received = new Map<string, number>();
    cdp.on('Network.requestWillBeSent', (e) => requests.set(e.requestId, new URL(e.request.url).pathname));
    cdp.on('Network.loadingFinished', (e) => {
      const p = requests.get(e.requestId);
      if (p) received.set(p, (received.get(p) ?? 0) + e.encodedDataLength);
    });
    for (const run of ['cold', 'warm (geometry cached)']) {
      requests.clear();
      received.clear();
      await page.goto(`/projects/${projectId}/revisions/${revisionId}`);
      await page.waitForFunction(() => window.__gaugelineView !== undefined, undefined, { timeout: 120_000 });
      const v = await page.evaluate(() => window.__gaugelineView!);
      console.log(`viewer, ${run}: ${v.memberCount} steel elements, ${v.drawCalls} draw calls, first coloured frame ${secs(v.firstColouredFrameMs)} after navigation (${secs(v.sinceMountMs)} after the view mounted)`);
      const total = [...received.values()].reduce((a, b) => a + b, 0);
      const apiCalls = [...requests.values()].filter((p) => p.startsWith('/api/')).length;
      const of = (suffix: string) => [...received].filter(([p]) => p.endsWith(suffix)).reduce((a, [, n]) => a + n, 0);
      console.log(`  transferred until then: ${mb(total)} in ${requests.size} requests (${apiCalls} API calls); geometry ${mb(of('/geometry'))}, member rows for the view and the ledger ${mb(of('/member-columns') + of('/members'))}`);
      if (run === 'cold') {
        const within = v.drawCalls < 100 && v.firstColouredFrameMs < 5000;
        console.log(`targets (< 100 draw calls, < 5 s): ${within ? 'met' : 'NOT met'}`);
        await page.getByTestId('model-view-canvas').evaluate((el) => el.scrollIntoView({ block: 'center' }));
        await page.screenshot({ path: path.join(dir, 'viewer.png') });
        const shot = path.join(root, '.test-data', 'screenshots');
        await page.screenshot({ path: path.join(shot, `viewer-${N}.png`) }).catch(() => undefined);
        // Interaction cost: one hover pick over the middle of the view.
        const box = (await page.getByTestId('model-view-canvas').boundingBox())!;
        const ms = await page.evaluate(async ([x, y]) => {
          const canvas = document.querySelector('[data-testid="model-view-canvas"] canvas')!;
          const start = performance.now();
          canvas.dispatchEvent(new PointerEvent('pointermove', { clientX: x, clientY: y, bubbles: true }));
          await new Promise((r) => requestAnimationFrame(() => requestAnimationFrame(r)));
          return performance.now() - start;
        }, [box.x + box.width / 2, box.y + box.height / 2]);
        console.log(`hover pick over ${N} members: ${Math.round(ms)} ms including two frames`);
      }
    }
    if (problems.length) console.log(`page errors: ${problems.join('; ')}`);
    await context.close();
  } finally {
    await browser.close();
    await app.stop();
    await db.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

(process.argv.includes('--write-model') ? writeModel() : main()).then(
  () => process.exit(0),
  (err) => {
    console.error(err instanceof Error ? err.stack : err);
    process.exit(1);
  },
);

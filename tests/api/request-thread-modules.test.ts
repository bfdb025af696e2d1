// The request thread loads only what it serves with: web-ifc and the export writers' libraries
// (spreadsheet, PDF) run in worker threads. Loaded on the request thread they had doubled its heap
// (46 → 103 MB after the warm-up import), and every full collection there marks all of it —
// seven of them during one large upload (scripts/bench/findings.md, eighth session).
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** Packages under node_modules that importing `entry` loads, among `watched`. */
function packagesLoadedBy(entry: string, watched: string[]): string[] {
  const code = `
    import { createRequire } from 'node:module';
    const require = createRequire(import.meta.url);
    await import(${JSON.stringify(path.join(root, entry))});
    const watched = ${JSON.stringify(watched)};
    const loaded = new Set();
    for (const file of Object.keys(require.cache)) {
      const m = /node_modules\\/((?:@[^/]+\\/)?[^/]+)\\//.exec(file);
      if (m && watched.includes(m[1])) loaded.add(m[1]);
    }
    console.log(JSON.stringify([...loaded].sort()));
  `;
  const out = execFileSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', code], { cwd: root, encoding: 'utf8' });
  return JSON.parse(out.trim().split('\n').pop()!);
}

describe('modules of the request thread', () => {
  // Both are CommonJS, so a load shows in require.cache (the PDF library, an ES module, comes in
  // with the same writers).
  const heavy = ['web-ifc', 'exceljs'];

  it('does not load web-ifc or the export writers\' libraries', () => {
    expect(packagesLoadedBy('server/index.ts', heavy)).toEqual([]);
  }, 60_000);

  it('sees them where they are loaded (the export writers)', () => {
    expect(packagesLoadedBy('server/exports/export-formats.ts', heavy)).toEqual(['exceljs', 'web-ifc']);
  }, 60_000);
});

// BCF 2.1 export: unzipped with yauzl, every XML file validated with xmllint against the
// buildingSMART schemas (BCF_SCHEMA_DIR, default ../shared/reference/bcf-2.1-schemas).
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import yauzl from 'yauzl';
import { writeBcf, frameMember, CRITICAL_BANDS } from '../../server/exports/bcf-export';
import type { ExportBundle } from '../../server/exports/export-bundle';
import { ROOT, sampleBundle } from '../support/export-fixture';

const SCHEMA_DIR = path.resolve(ROOT, process.env.BCF_SCHEMA_DIR ?? '../shared/reference/bcf-2.1-schemas');
const SCHEMA_FOR: Record<string, string> = { 'bcf.version': 'version.xsd', 'markup.bcf': 'markup.xsd', 'viewpoint.bcfv': 'visinfo.xsd' };

function unzip(buf: Buffer): Promise<Map<string, string>> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(buf, { lazyEntries: true }, (err, zip) => {
      if (err || !zip) return reject(err);
      const files = new Map<string, string>();
      zip.on('entry', (e: yauzl.Entry) =>
        zip.openReadStream(e, (err2, s) => {
          if (err2 || !s) return reject(err2);
          const chunks: Buffer[] = [];
          s.on('data', (c: Buffer) => chunks.push(c));
          s.on('end', () => (files.set(e.fileName, Buffer.concat(chunks).toString('utf8')), zip.readEntry()));
        }),
      );
      zip.on('end', () => resolve(files));
      zip.readEntry();
    });
  });
}

function xmllint(xml: string, xsd: string): { ok: boolean; out: string } {
  const dir = mkdtempSync(path.join(tmpdir(), 'bcf-'));
  const file = path.join(dir, 'doc.xml');
  writeFileSync(file, xml);
  const r = spawnSync('xmllint', ['--noout', '--schema', path.join(SCHEMA_DIR, xsd), file], { encoding: 'utf8' });
  if (r.error) throw new Error(`xmllint could not run (${r.error.message}); install libxml2-utils`);
  return { ok: r.status === 0, out: r.stderr };
}

let bundle: ExportBundle;
let files: Map<string, string>;
beforeAll(async () => {
  const all = await sampleBundle();
  bundle = { ...all, members: all.members.filter((m) => CRITICAL_BANDS.includes(m.row.band)) };
  files = await unzip(await writeBcf(bundle));
}, 120_000);

describe('BCF export', () => {
  it('has bcf.version and one folder per critical member with markup.bcf and viewpoint.bcfv', () => {
    expect(bundle.members.length).toBeGreaterThan(1);
    expect(files.get('bcf.version')).toMatch(/VersionId="2\.1"/);
    const topics = [...files.keys()].filter((k) => k.endsWith('/markup.bcf')).map((k) => k.split('/')[0]);
    expect(topics).toHaveLength(bundle.members.length);
    for (const t of topics) {
      expect(t).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/);
      expect(files.has(`${t}/viewpoint.bcfv`)).toBe(true);
    }
    expect(files.size).toBe(1 + 2 * topics.length);
  });

  it('names each member, its utilisation and governing mode, and selects its GlobalId in the viewpoint', () => {
    for (const m of bundle.members) {
      const markup = [...files.entries()].find(([k, v]) => k.endsWith('markup.bcf') && v.includes(m.row.globalId));
      expect(markup, m.row.globalId).toBeDefined();
      const [name, xml] = markup!;
      expect(xml).toContain(m.row.utilisation!.toFixed(2));
      expect(xml).toContain(m.row.governing!);
      expect(xml).toContain('licensed');
      const vp = files.get(name.replace('markup.bcf', 'viewpoint.bcfv'))!;
      expect(vp).toContain(`<Component IfcGuid="${m.row.globalId}"/>`);
    }
  });

  it('frames the member: the camera looks at its midpoint (metres, IFC world frame)', () => {
    for (const m of bundle.members.filter((x) => x.detail.axis)) {
      const { start, end } = m.detail.axis!;
      const cam = frameMember(m.detail.axis!);
      const mid = [0, 1, 2].map((i) => (start[i] + end[i]) / 2000);
      const to = mid.map((v, i) => v - cam.position[i]);
      const dist = Math.hypot(...to);
      const cos = to.reduce((s, v, i) => s + v * cam.direction[i], 0) / dist;
      expect(cos).toBeGreaterThan(0.9999);
      expect(dist).toBeGreaterThan(Math.hypot(end[0] - start[0], end[1] - start[1], end[2] - start[2]) / 2000);
    }
  });

  if (existsSync(path.join(SCHEMA_DIR, 'markup.xsd'))) {
    it('every XML file is valid against the BCF 2.1 schemas', () => {
      for (const [name, xml] of files) {
        const xsd = SCHEMA_FOR[path.basename(name)];
        expect(xsd, name).toBeDefined();
        const r = xmllint(xml, xsd);
        expect(r.ok, `${name}: ${r.out}`).toBe(true);
      }
    });
    it('the validation can fail: a markup without its Title is rejected', () => {
      const [, xml] = [...files.entries()].find(([k]) => k.endsWith('markup.bcf'))!;
      expect(xmllint(xml.replace(/<Title>.*<\/Title>/, ''), 'markup.xsd').ok).toBe(false);
    });
  } else {
    console.warn(`BCF schemas not found in ${SCHEMA_DIR}; schema validation tests not registered (set BCF_SCHEMA_DIR).`);
  }
});

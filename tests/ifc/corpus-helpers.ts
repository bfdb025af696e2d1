/**
 * Finds the shared IFC corpus (IFC_CORPUS_DIR, default ../shared/ifc-corpus from the repo
 * root) and reads each file once per test file. Where a file is absent the suite says so and
 * registers a single test for that warning path instead of the file's assertions.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ExtractedModel } from '../../server/ifc/types.ts';

const repoRoot = resolve(fileURLToPath(new URL('.', import.meta.url)), '../..');
export const CORPUS_DIR = process.env.IFC_CORPUS_DIR ? resolve(process.env.IFC_CORPUS_DIR) : resolve(repoRoot, '../shared/ifc-corpus');

/** Paths of the corpus's .ifc files in name order; none where the corpus is absent (the suites say so). */
export const CORPUS_IFC_FILES = existsSync(CORPUS_DIR) ? readdirSync(CORPUS_DIR).filter((f) => f.endsWith('.ifc')).sort().map((f) => join(CORPUS_DIR, f)) : [];
/** Paths of our own sample models (samples/*.ifc) in name order. */
export const SAMPLE_IFC_FILES = readdirSync(join(repoRoot, 'samples')).filter((f) => f.endsWith('.ifc')).sort().map((f) => join(repoRoot, 'samples', f));

export const FILES = {
  f1: 'ifc2x3_schependomlaan_BERNTS-Staalconstructie_bolts.ifc',
  f2: 'ifc2x3_schependomlaan_BALKONHEKKEN_steel-holes-as-openings.ifc',
  f3: 'ifc2x3_schependomlaan_MULTICOM-trappen_realizing-welds.ifc',
  f4: 'ifc2x3_webifc_ISSUE_021_steel-precast-assemblies.ifc',
  f5: 'ifc2x3_ifcopenshell_IfcLShapeProfileDef.ifc',
  f6: 'ifc4_bsi-annexE_beam-standard-case_profile-set-usage.ifc',
  f7: 'ifc4_bsi-annexE_structural-analysis-curve-member_results.ifc',
  f8: 'ifc4_webifc_ISSUE_171_analysis-model-with-physical-links.ifc',
  f9: 'ifc4x3_bsi_structural-curve-member_results.ifc',
  f10: 'ifc4x3_bsi_beam-varying-cardinal-points.ifc',
} as const;

export const corpusPath = (name: string) => join(CORPUS_DIR, name);
export const corpusText = (name: string) => readFileSync(corpusPath(name), 'latin1');

const cache = new Map<string, Promise<ExtractedModel>>();
export function readCorpus(name: string): Promise<ExtractedModel> {
  let p = cache.get(name);
  if (!p) cache.set(name, (p = readIfcModel(new Uint8Array(readFileSync(corpusPath(name))))));
  return p;
}

/** describe() for one corpus file, or a single warning-path test when the file is absent. */
export function corpusSuite(label: string, name: string, body: () => void): void {
  if (existsSync(corpusPath(name))) {
    describe(`${label}: ${name}`, body);
    return;
  }
  const message = `IFC corpus file ${name} not found in ${CORPUS_DIR}; its tests are not registered.`;
  console.warn(message);
  it(`${label} is absent, so its assertions are not registered`, () => {
    expect(existsSync(corpusPath(name))).toBe(false);
  });
}

/** Counts `#n= IFCXXX(` occurrences in the file text (how the MANIFEST counted). */
export function countEntities(text: string, entity: string): number {
  return (text.match(new RegExp(`=\\s*${entity}\\(`, 'g')) ?? []).length;
}

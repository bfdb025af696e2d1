// An import checks each distinct member-end input once (server/imports/capacity-checks.ts)
// and reuses the capacities for every end with the same input, applying each member's own
// force. The records must be exactly those of running the engine for every end.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkMemberRaw, withForce, type CheckResult, type MemberCheckInputRaw } from '../../shared/engine';
import { STANDARDS } from '../../shared/api/projects';
import { readIfcModel } from '../../server/ifc/read-model.ts';
import type { ExtractedModel } from '../../server/ifc/types.ts';
import { CapacityChecks } from '../../server/imports/capacity-checks.ts';
import { checkModel, type CheckSettings } from '../../server/imports/check-members.ts';
import { StorableSlices } from '../../server/imports/member-slices.ts';
import { makeSyntheticModel } from '../../scripts/samples/make-samples.ts';
import { CORPUS_DIR, CORPUS_IFC_FILES, SAMPLE_IFC_FILES } from './corpus-helpers.ts';

const samples = SAMPLE_IFC_FILES;
const corpus = CORPUS_IFC_FILES;
if (!corpus.length) console.warn(`capacity-checks: no corpus at ${CORPUS_DIR}; only the samples and a synthetic model are compared`);



/** Table forces for every member: tension, none, compression in turn (N), so every force rule is met. */
function mixedForces(model: ExtractedModel): CheckSettings['tableForces'] {
  return new Map(model.members.map((m, i) => [m.globalId, [{ loadCase: 'T1', axialN: [150_000, 0, -80_000][i % 3] + i }]]));
}

describe('checking each distinct member end once', () => {
  const files: [string, () => Uint8Array | Promise<Uint8Array>][] = [
    ...[...corpus, ...samples].map((f): [string, () => Uint8Array] => [f.split('/').pop()!, () => new Uint8Array(readFileSync(f))]),
    ['synthetic model of 40 members', () => makeSyntheticModel(40)],
  ];
  for (const [name, load] of files) {
    it(`${name}: the same records as checking every end`, async () => {
      const model = await readIfcModel(await load(), { listProfiles: false });
      let reused = 0;
      for (const standard of STANDARDS) {
        for (const tableForces of [undefined, mixedForces(model)]) {
          const settings: CheckSettings = { standard, defaultGrade: standard.startsWith('aisc') ? 'A36' : standard === 'en1993' ? 'S355' : '300', tableForces };
          const checks = new CapacityChecks();
          const records = checkModel(model, settings, undefined, checks);
          expect(JSON.stringify(records)).toBe(JSON.stringify(checkModel(model, settings, undefined, { check: checkMemberRaw })));
          // Stored as capacities, each written once, and read back with the member's force: the same text.
          const slice = new StorableSlices().of(records);
          const bodies = new Map(slice.capacities.map((c) => [c.key, c.bodyJson]));
          const readBack = slice.members.map((m) => (m.capacityKey === null ? null : JSON.stringify(withForce(JSON.parse(bodies.get(m.capacityKey)!) as CheckResult, m.designForceN))));
          expect(readBack).toEqual(records.map((r) => (r.result ? JSON.stringify(r.result) : null)));
          expect(slice.capacities.length).toBeLessThanOrEqual(checks.counts.checked);
          reused += checks.counts.reused;
        }
      }
      if (name.startsWith('kestrel') || name.startsWith('synthetic')) expect(reused).toBeGreaterThan(0);
    }, 120_000);
  }

  const flat: MemberCheckInputRaw = {
    standard: 'as4100', section: { shape: 'flat', width: 80, thickness: 10 }, steel: { grade: '300' },
    holes: [{ x: 40, y: 40, d: 18 }, { x: 100, y: 40, d: 18 }], bolts: { diameter: 16, grade: '8.8', count: 2 }, force: 50_000,
  };
  const outcome = (run: () => unknown) => {
    try {
      return JSON.stringify(run());
    } catch (e) {
      return `error: ${(e as Error).message}`;
    }
  };

  it('refuses a force the schema refuses, as the engine does', () => {
    const checks = new CapacityChecks();
    checks.check(flat);
    for (const force of [Number.NaN, Number.POSITIVE_INFINITY]) {
      const input = { ...flat, force };
      const direct = outcome(() => checkMemberRaw(input));
      expect(direct.startsWith('error')).toBe(true);
      expect(outcome(() => checks.check(input))).toBe(direct);
    }
  });

  it('tells inputs apart that JSON alone would not (NaN, Infinity and null)', () => {
    const checks = new CapacityChecks();
    const variants = [null, Number.NaN, Number.POSITIVE_INFINITY, 30] as unknown as number[];
    for (const x of variants) {
      const input = { ...flat, holes: [{ x, y: 40, d: 18 }, { x: 100, y: 40, d: 18 }] };
      expect(outcome(() => checks.check(input))).toBe(outcome(() => checkMemberRaw(input)));
    }
    expect(checks.counts.checked).toBe(variants.length);
  });
});

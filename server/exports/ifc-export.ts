/**
 * IFC with results: the uploaded model, unchanged, plus a property set of our own on each
 * exported member, so any IFC viewer can colour or filter by utilisation. The property
 * set name is ours (`Gaugeline_TensionCheck`), never a buildingSMART `Pset_` name.
 */
import { CAUTION_SUMMARY } from '@shared/api/cautions';
import { BAND_STYLE } from '@shared/api/results';
import { writePropertySets, type MemberPset } from '../ifc/write-results';
import type { ExportBundle } from './export-bundle';
import { assumptionsText, editionOf, isoDate, standardLabel } from './export-text';

export const RESULTS_PSET = 'Gaugeline_TensionCheck';

export function resultPsets(bundle: ExportBundle): MemberPset[] {
  const standard = standardLabel(bundle.revision.standard);
  const edition = editionOf(bundle);
  return bundle.members.map((m) => {
    const props: MemberPset['properties'] = [];
    if (m.row.utilisation != null) props.push({ name: 'Utilisation', kind: 'ratio', value: m.row.utilisation });
    if (m.row.governing) props.push({ name: 'GoverningMode', kind: 'label', value: m.row.governing });
    if (m.row.designCapacityN != null) props.push({ name: 'DesignCapacity', kind: 'force', valueN: m.row.designCapacityN });
    if (m.row.designForceN != null) props.push({ name: 'DesignForce', kind: 'force', valueN: m.row.designForceN });
    props.push(
      { name: 'ResultBand', kind: 'label', value: BAND_STYLE[m.row.band].label },
      { name: 'Standard', kind: 'label', value: standard },
      { name: 'Edition', kind: 'label', value: edition },
      { name: 'EngineVersion', kind: 'label', value: bundle.engineVersion },
      { name: 'CheckDate', kind: 'date', value: isoDate(bundle.revision.checkedAt) },
      { name: 'ExportDate', kind: 'date', value: isoDate(bundle.generatedAt) },
      { name: 'AssumedValues', kind: 'text', value: assumptionsText(m) || 'none' },
      { name: 'Cautions', kind: 'text', value: CAUTION_SUMMARY },
    );
    return { globalId: m.row.globalId, properties: props };
  });
}

export async function writeIfcWithResults(modelBytes: Uint8Array, bundle: ExportBundle): Promise<Buffer> {
  const out = await writePropertySets(modelBytes, RESULTS_PSET, resultPsets(bundle));
  return Buffer.from(out.bytes.buffer, out.bytes.byteOffset, out.bytes.byteLength);
}

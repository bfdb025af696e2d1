/**
 * BCF 2.1 export: one topic per exported member (the routes and the command line pass
 * the critical ones by default), each naming the member, its utilisation and governing
 * mode, with a viewpoint that selects and colours the member and frames it with a
 * perspective camera in the IFC world frame, in metres.
 */
import { createHash } from 'node:crypto';
import yazl from 'yazl';
import { CAUTIONS } from '@shared/api/cautions';
import { BAND_STYLE } from '@shared/api/results';
import { kN, memberLabel, type ExportBundle, type ExportMember } from './export-bundle';
import { assumptionsText, fixed, standardLine } from './export-text';
import { markupXml, versionXml, viewpointXml, type V3 } from './bcf-xml';

export { CRITICAL_BANDS } from './export-bundle';

const FIELD_OF_VIEW = 60;

/** A stable UUID (name-based, SHA-1) so the same member of the same revision keeps its topic. */
export function stableUuid(...parts: string[]): string {
  const h = createHash('sha1').update(parts.join('\u0000')).digest();
  h[6] = (h[6] & 0x0f) | 0x50;
  h[8] = (h[8] & 0x3f) | 0x80;
  const x = h.subarray(0, 16).toString('hex');
  return `${x.slice(0, 8)}-${x.slice(8, 12)}-${x.slice(12, 16)}-${x.slice(16, 20)}-${x.slice(20, 32)}`;
}

const sub = (a: V3, b: V3): V3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const dot = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const scale = (a: V3, k: number): V3 => [a[0] * k, a[1] * k, a[2] * k];
const unit = (a: V3): V3 => scale(a, 1 / (Math.hypot(...a) || 1));
const round = (a: V3): V3 => a.map((v) => Math.round(v * 1e4) / 1e4) as V3;

/**
 * Camera looking down at the member's midpoint from an oblique direction, far enough
 * that the whole member fits the field of view. Axis in mm; result in metres.
 */
export function frameMember(axis: { start: V3; end: V3 }): { position: V3; direction: V3; up: V3; fieldOfView: number } {
  const a = scale(axis.start, 1e-3);
  const b = scale(axis.end, 1e-3);
  const mid = scale([a[0] + b[0], a[1] + b[1], a[2] + b[2]], 0.5);
  const along = unit(sub(b, a));
  const length = Math.hypot(...sub(b, a));
  // Oblique view from above; if the member runs along it, look from the other diagonal.
  let direction = unit([1, 1, -0.7]);
  if (Math.abs(dot(direction, along)) > 0.9) direction = unit([1, -1, -0.7]);
  const distance = (Math.max(length, 1) / 2 / Math.tan((FIELD_OF_VIEW / 2) * (Math.PI / 180))) * 1.3 + 1;
  const position = sub(mid, scale(direction, distance));
  const z: V3 = [0, 0, 1];
  const up = unit(sub(z, scale(direction, dot(z, direction))));
  return { position: round(position), direction: round(direction), up: round(up), fieldOfView: FIELD_OF_VIEW };
}

function description(m: ExportMember, b: ExportBundle): string {
  const clause = m.result?.modes.find((x) => x.name === m.result?.governing)?.clause;
  return [
    `Member ${memberLabel(m.row)} (IFC GlobalId ${m.row.globalId}, ${m.row.ifcClass}, ${m.row.profile ?? 'no profile'}, ${m.row.grade ?? 'no grade'}).`,
    `Utilisation ${fixed(m.row.utilisation, 2)}: design force ${fixed(kN(m.row.designForceN), 1)} kN, design capacity ${fixed(kN(m.row.designCapacityN), 1)} kN, governed by ${m.row.governing ?? 'no mode'}${clause ? ` (${clause})` : ''}.`,
    `Checked to ${standardLine(b)} with Gaugeline engine ${b.engineVersion}, revision ${b.revision.number} (${b.revision.fileName}), exported ${b.generatedAt}.`,
    `Assumed values: ${assumptionsText(m) || 'none'}.`,
    m.row.warnings.length ? `Warnings: ${m.row.warnings.join(' ')}` : 'Warnings: none.',
    `Cautions: ${CAUTIONS.join(' ')}`,
  ].join('\n');
}

export function writeBcf(bundle: ExportBundle): Promise<Buffer> {
  const zip = new yazl.ZipFile();
  const mtime = new Date(bundle.generatedAt);
  zip.addBuffer(Buffer.from(versionXml(), 'utf8'), 'bcf.version', { mtime });
  bundle.members.forEach((m, index) => {
    const topicGuid = stableUuid('topic', bundle.revision.fileName, String(bundle.revision.number), m.row.globalId);
    const viewpointGuid = stableUuid('viewpoint', topicGuid);
    const band = BAND_STYLE[m.row.band];
    const markup = markupXml({
      topicGuid,
      viewpointGuid,
      title: `${memberLabel(m.row)}: utilisation ${fixed(m.row.utilisation, 2) || 'unknown'}, ${m.row.governing ?? 'not checked'}`,
      description: description(m, bundle),
      labels: [`band ${band.label}`, 'tension check'],
      created: bundle.generatedAt,
      author: 'Gaugeline',
      fileName: bundle.revision.fileName,
      fileDate: bundle.revision.checkedAt,
      index: index + 1,
    });
    const viewpoint = viewpointXml({
      viewpointGuid,
      ifcGuid: m.row.globalId,
      colour: band.colour.slice(1).toUpperCase(),
      camera: m.detail.axis ? frameMember(m.detail.axis) : null,
    });
    zip.addBuffer(Buffer.from(markup, 'utf8'), `${topicGuid}/markup.bcf`, { mtime });
    zip.addBuffer(Buffer.from(viewpoint, 'utf8'), `${topicGuid}/viewpoint.bcfv`, { mtime });
  });
  zip.end();
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    zip.outputStream.on('data', (c: Buffer) => chunks.push(c));
    zip.outputStream.on('end', () => resolve(Buffer.concat(chunks)));
    zip.outputStream.on('error', reject);
  });
}

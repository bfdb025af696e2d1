import type { IncomingMessage } from 'node:http';
import type { MemberSheet } from '@shared/api/member-sheet';
import { CAUTIONS } from '@shared/api/cautions';
import { withForce, type CheckResult } from '@shared/engine';
import type { SessionUser } from '@shared/api/session';
import { MemberModel } from '../../db/models/member';
import { plainRead, type Statement } from '../../db/plain-read';
import { takeCompanion, takeVisibleRevision, type Companion } from '../../http/request-read-ahead';
import { presentMemberRow } from './member-presenter';

/** Member columns as attribute names (the detail JSON left out), for the sheet's one-query read below. */
let memberSelect: string | undefined;
const MEMBER_SELECT = () =>
  (memberSelect ??= Object.entries(MemberModel.getAttributes() as Record<string, { field?: string }>)
    .filter(([name]) => name !== 'detail')
    .map(([name, a]) => `m.\`${a.field ?? name}\` AS \`${name}\``)
    .join(', '));

interface SheetExtras {
  detailText: string;
  capacityText: string | null;
  engineVersion: string | null;
  revisionNumber: number;
  revisionStandard: string;
  revisionFileName: string;
}
type SheetRow = Record<string, unknown> & SheetExtras;
type ForceRow = { loadCase: string; axialN: number; source: string };

/** A member's GlobalId as IFC writes it: 22 characters of its base-64 alphabet. */
const GLOBAL_ID_CHARS = '[0-9A-Za-z_$]{22}';
export const GLOBAL_ID = new RegExp(`^${GLOBAL_ID_CHARS}$`);

/**
 * The sheet's two statements: the member with its revision and stored result in one join,
 * and its forces. With `access`, the first also checks the caller may see the member
 * (admins, or members of the project); without, the caller must have checked the revision first.
 */
function sheetStatements(revisionId: number, globalId: string, access?: { projectId: number; user: SessionUser }): [Statement, Statement] {
  const accessSql = access ? `AND md.project_id = ? AND (? OR EXISTS (SELECT 1 FROM project_members pm WHERE pm.project_id = md.project_id AND pm.user_id = ?))` : '';
  return [
    {
      sql: `SELECT ${MEMBER_SELECT()}, CAST(m.detail AS CHAR) AS detailText, CAST(cc.body AS CHAR) AS capacityText, cr.engine_version AS engineVersion,
                   r.number AS revisionNumber, r.standard AS revisionStandard, r.file_name AS revisionFileName
            FROM members m
            JOIN revisions r ON r.id = m.revision_id
            JOIN models md ON md.id = r.model_id
            LEFT JOIN check_results cr ON cr.member_id = m.id AND cr.standard = r.standard
            LEFT JOIN check_capacities cc ON cc.id = cr.capacity_id
            WHERE m.revision_id = ? AND m.global_id = ? ${accessSql}
            LIMIT 1`,
      values: access ? [revisionId, globalId, access.projectId, access.user.role === 'admin', access.user.id] : [revisionId, globalId],
    },
    // Read alongside; only answered when the query above shows the caller may see the member.
    {
      sql: `SELECT f.load_case AS loadCase, f.axial_n AS axialN, f.source FROM member_forces f JOIN members m ON m.id = f.member_id
            WHERE m.revision_id = ? AND m.global_id = ? ORDER BY f.source ASC, f.load_case ASC`,
      values: [revisionId, globalId],
    },
  ];
}

/**
 * The sheet as JSON text (MemberSheet), or null when there is no such member. The stored detail
 * (about 2 KB) is JSON we wrote; it is read as text and placed in the answer as it is, not parsed
 * and written again. The result is the stored capacity with the member's design force applied,
 * as the import made it (withForce). The sheet is the busiest read after the table.
 */
function sheetJsonOf(revisionId: number, rows: SheetRow[], forces: ForceRow[]): string | null {
  const row = rows[0];
  if (!row) return null;
  const member = presentMemberRow({ ...row, isTension: Boolean(row.isTension) } as unknown as MemberModel);
  const rest: Omit<MemberSheet, 'detail' | 'result'> = {
    revision: { id: revisionId, number: row.revisionNumber, standard: row.revisionStandard, fileName: row.revisionFileName },
    member,
    forces: forces.map((f) => ({ loadCase: f.loadCase, axialN: f.axialN, source: f.source })),
    engineVersion: row.engineVersion ?? null,
    cautions: CAUTIONS,
  };
  const result = row.capacityText === null ? null : withForce(JSON.parse(row.capacityText) as CheckResult, row.designForceN as number | null);
  return `${JSON.stringify(rest).slice(0, -1)},"detail":${row.detailText},"result":${JSON.stringify(result)}}`;
}

/** The member sheet as JSON text, or null when the caller cannot see such a member: two statements side by side on one connection. */
export async function memberSheetJson(user: SessionUser, projectId: number, revisionId: number, globalId: string): Promise<string | null> {
  const [rows, forces] = await plainRead<[SheetRow[], ForceRow[]]>(MemberModel.sequelize!, sheetStatements(revisionId, globalId, { projectId, user }));
  return sheetJsonOf(revisionId, rows, forces);
}

const SHEET_PATH = new RegExp(`^/projects/(\\d{1,15})/revisions/(\\d{1,15})/members/(${GLOBAL_ID_CHARS})(?:\\?|$)`);
const COMPANION = 'member-sheet';

/**
 * Sent with the session read for GET …/members/:globalId, so a sheet costs one round trip to
 * MariaDB instead of two. The statements carry no access check: what they read is used only
 * after the revision read with the same session was found visible (memberSheetJsonReadAhead).
 */
export const memberSheetCompanion: Companion = {
  name: COMPANION,
  statementsFor(req: IncomingMessage) {
    if (req.method !== 'GET') return undefined;
    const m = SHEET_PATH.exec(req.url ?? '');
    if (!m) return undefined;
    const [revisionId, globalId] = [Number(m[2]), m[3]];
    return { key: `${revisionId}/${globalId}`, statements: sheetStatements(revisionId, globalId) };
  },
};

/** The sheet from what was read with the session, when that read found the revision visible to this user; else undefined. */
export function memberSheetJsonReadAhead(req: IncomingMessage, user: SessionUser, projectId: number, revisionId: number, globalId: string): string | null | undefined {
  if (!takeVisibleRevision(req, user.id, projectId, revisionId)) return undefined;
  const read = takeCompanion(req, COMPANION, `${revisionId}/${globalId}`);
  return read && sheetJsonOf(revisionId, read[0] as SheetRow[], read[1] as ForceRow[]);
}

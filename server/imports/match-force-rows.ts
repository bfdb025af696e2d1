import type { ForceRow, ForcesProblem } from '@shared/forces/parse-forces-csv';

export interface MatchedForces {
  /** Forces per member GlobalId (N, tension positive). */
  byGlobalId: Map<string, { loadCase: string; axialN: number }[]>;
  problems: ForcesProblem[];
}

/**
 * Matches forces-table rows to the members of a model read from a file: by GlobalId,
 * else by a tag that only one member carries. Same rule as applying a table to a stored
 * revision; a row that matches nothing is a problem, not silently dropped.
 */
export function matchForceRows(rows: ForceRow[], members: { globalId: string; tag: string | null }[]): MatchedForces {
  const gids = new Set(members.map((m) => m.globalId));
  const byTag = new Map<string, string[]>();
  for (const m of members) if (m.tag) byTag.set(m.tag, [...(byTag.get(m.tag) ?? []), m.globalId]);
  const byGlobalId = new Map<string, { loadCase: string; axialN: number }[]>();
  const problems: ForcesProblem[] = [];
  for (const row of rows) {
    let gid = row.globalId && gids.has(row.globalId) ? row.globalId : undefined;
    if (!gid && row.tag) {
      const found = byTag.get(row.tag) ?? [];
      if (found.length > 1) {
        problems.push({ line: row.line, message: `the tag "${row.tag}" belongs to ${found.length} members; use the GlobalId` });
        continue;
      }
      gid = found[0];
    }
    if (!gid) {
      problems.push({ line: row.line, message: `no member ${row.globalId ?? `with tag "${row.tag}"`} in the model` });
      continue;
    }
    byGlobalId.set(gid, [...(byGlobalId.get(gid) ?? []), { loadCase: row.loadCase, axialN: row.axialN }]);
  }
  return { byGlobalId, problems };
}

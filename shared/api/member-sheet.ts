import type { MemberRow } from './members';
import type { MemberDetail } from './member-detail';
import type { ResultBand } from './results';

/** GET …/revisions/:id/members/:globalId — everything the member sheet shows. */
export interface MemberSheet {
  revision: { id: number; number: number; standard: string; fileName: string };
  member: MemberRow;
  detail: MemberDetail;
  forces: { loadCase: string; axialN: number; source: string }[];
  /** The engine's result (CheckResult from shared/engine) or null when not checked. */
  result: {
    designCapacity: number;
    utilisation: number | null;
    governing: string;
    grossArea: number;
    netArea: number;
    modes: { name: string; capacity: number; clause: string }[];
    trace: { symbol: string; description: string; formula: string; substituted: string; value: number; unit: string; clause: string }[];
    assumptions: { name: string; value: string | number; source: string }[];
    warnings: string[];
    net: unknown;
  } | null;
  engineVersion: string | null;
  cautions: readonly string[];
}

/** GET …/revisions/:id/overview */
export interface RevisionOverview {
  total: number;
  bands: Record<ResultBand, number>;
  /** Utilisation histogram, bins of 0.1 from 0 to 1.5 and a last open bin. */
  histogram: { from: number; to: number | null; count: number }[];
  critical: MemberRow[];
}

import type { Section } from '../engine/section-types.ts';
import type { ActiveOverrides } from './overrides';

/** A hole of one end on the developed strip, as checked. mm. */
export interface StripHole {
  x: number;
  y: number;
  /** Hole diameter as made (null: from the bolt and the standard's rule). */
  d: number | null;
  t: number | null;
  element: string;
  source: string;
  featureGlobalId?: string;
}

export interface MemberEndDetail {
  end: 'start' | 'end';
  holes: StripHole[];
  boltDiameter: number | null;
  boltGrade: string | null;
  boltGroupGlobalId: string | null;
  /** Design capacity of this end's check, N; null when not checked. */
  designCapacity: number | null;
  governing: string | null;
}

/** What the member sheet shows besides the check result; stored as JSON per member. */
export interface MemberDetail {
  objectType: string | null;
  predefinedType: string | null;
  assemblyGlobalId: string | null;
  profile: { name: string | null; section: Section | null; source: string; areaFromModel?: number };
  material: { name: string; source: string; strengthSource?: string; fy?: number; fu?: number } | null;
  /** The steel used in the check and where its strengths came from. */
  steel: { grade: string; fy: number; fu: number; source: string; fromDefault: boolean } | null;
  tensionSignals: string[];
  axis: { start: [number, number, number]; end: [number, number, number] } | null;
  ends: MemberEndDetail[];
  /** The engine input of the governing end, kept so a member can be re-checked without the file. */
  checkInput: unknown | null;
  warnings: string[];
  /** Engineer's overrides in force, with who set them, when and why. */
  overrides?: ActiveOverrides;
}

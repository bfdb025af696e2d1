/**
 * Plain data returned by readIfcModel. Everything is in SI-derived units, converted once:
 * lengths mm, areas mm², forces N, stresses MPa. No web-ifc objects appear here.
 * Members, bolt groups and analysis members are keyed by IFC GlobalId.
 */
import type { Section } from '../../shared/engine/section-types.ts';

export type IfcSchema = 'IFC2X3' | 'IFC4' | 'IFC4X3';
export type Vec3 = [number, number, number];

export type ReadPhase = 'reading' | 'extracting';
export type ProgressCallback = (phase: ReadPhase, fraction: number) => void;

export interface ForcePsetSpec {
  /** Property set name, e.g. 'Gaugeline_MemberForces'. */
  pset: string;
  /** Property holding the axial force (IfcForceMeasure, tension positive). */
  force: string;
  /** Property holding the load case label; optional. */
  loadCase?: string;
}

export interface ReadOptions {
  progress?: ProgressCallback;
  forcePsetNames?: ForcePsetSpec[];
  /** Slots of the line cache (tests make it tiny to exercise eviction); see model-context.ts. */
  cacheSize?: number;
  /**
   * 'text' (default): lines come from the file's text where that gives web-ifc's own line
   * objects, else from web-ifc; 'web-ifc': every line through web-ifc's GetLine (tests compare the two).
   */
  readLinesWith?: 'text' | 'web-ifc';
  /**
   * false: leave `profileDefinitions` empty. The list reads every parameterised profile in the
   * file again, hole and bolt circles included (180,000 at 20,000 benchmark members, about
   * 0.5 s); imports do not use it, tests and tools do. Default true.
   */
  listProfiles?: boolean;
  /**
   * true: web-ifc opens the file before anything is read (the way a read takes anyway when the
   * text is irregular, read-model.ts); default false: the text first, web-ifc only if a line
   * needs it. Tests compare the two.
   */
  webIfcFirst?: boolean;
  /**
   * true: a second thread indexes the second half of the text and reads the bolt groups while
   * members are read (text-first reads only, reader-thread.ts); false: all in this thread.
   * Default: true from 64 MB up (read-model.ts).
   */
  readerThread?: boolean;
  /** Filled in by readIfcModel when given: where the time went, for benchmarks. */
  stats?: ReadStats;
}

/** Counters of one read (benchmarks and tests; not part of the extracted model). */
export interface ReadStats {
  /** web-ifc OpenModel, ms. */
  openMs: number;
  /** Everything after opening until the model is returned, ms. */
  extractMs: number;
  /** Lines handed to the extractors (cache misses). */
  linesRead: number;
  /** Lines came from the file's text (read text first, or web-ifc counted the same lines); openMs is 0 when read text first. */
  textReader?: boolean;
  /** Of those, lines read through web-ifc's GetLine. */
  linesFromWebIfc: number;
  /** CPU ms of the process per phase of the extraction. */
  phases?: Record<string, number>;
}

export interface UnitsInfo {
  /** The file's length unit as written, e.g. 'MILLI METRE' or 'inch'. */
  lengthUnitName: string;
  /** Multiply a file length by this to get mm. */
  lengthToMm: number;
  forceUnitName: string;
  forceToN: number;
  pressureUnitName: string;
  pressureToMPa: number;
  /** Multiply a file area by this to get mm². */
  areaToMm2: number;
}

export interface StoreyInfo {
  globalId: string;
  name: string;
  /** Elevation in mm, when given. */
  elevation: number | null;
}

export type ProfileSource =
  | 'material-profile-set'
  | 'swept-area'
  | 'ifc2x3-profile-properties'
  | 'catalogue-name'
  | 'none';

export interface ProfileInfo {
  name: string | null;
  section: Section | null;
  source: ProfileSource;
  /** Cross-section area stated in the model (e.g. Pset_ProfileMechanical), mm². */
  areaFromModel?: number;
}

export type MaterialSource =
  | 'material-profile-set'
  | 'material'
  | 'material-list'
  | 'material-layer-set'
  | 'property'
  | 'none';

export interface MaterialInfo {
  name: string;
  /** MPa, only when the model states it. */
  yieldStress?: number;
  ultimateStress?: number;
  source: MaterialSource;
  /** Where the strengths came from, when present. */
  strengthSource?: 'Pset_MaterialSteel' | 'Pset_MaterialMechanical' | 'ifc2x3-steel-properties';
}

export type HoleSource = 'opening' | 'voiding-feature' | 'boolean-cut' | 'bolt-derived';

export interface ExtractedHole {
  /** mm along the member axis from its start. */
  x: number;
  /** mm in the section-plane frame of shared/engine/section-types.ts. */
  u: number;
  v: number;
  /** Diameter as made, mm; null when it must come from the engine's clearance rule. */
  diameter: number | null;
  /** Thickness of the pierced plate/leg/flange, mm. */
  thickness: number | null;
  /** Section axis the hole axis is parallel to. */
  axis: 'u' | 'v';
  source: HoleSource;
  boltDiameter?: number;
  boltGroupGlobalId?: string;
  slot?: { length: number; width: number };
  /** GlobalId of the opening or voiding feature, when there is one. */
  featureGlobalId?: string;
}

/** Forces are axial, N, tension positive. */
export interface MemberForce {
  loadCase: string;
  axialForce: number;
  source: 'property-set' | 'analysis-model';
  /** Property set name or analysis member GlobalId the value came from. */
  from: string;
}

export type AxisSource = 'extrusion' | 'axis-representation' | 'brep-extent' | 'none';

export interface ExtractedMember {
  globalId: string;
  expressId: number;
  ifcClass: string;
  name: string | null;
  tag: string | null;
  objectType: string | null;
  /** Occurrence PredefinedType, else the type object's. */
  predefinedType: string | null;
  storey: string | null;
  assembly: { globalId: string; name: string | null; predefinedType: string | null } | null;
  profile: ProfileInfo;
  material: MaterialInfo | null;
  /** mm; body length where a body was understood, else axis length, else null. */
  length: number | null;
  /** World coordinates, mm. Start is where hole x = 0. */
  axis: { start: Vec3; end: Vec3 } | null;
  axisSource: AxisSource;
  tensionSignals: string[];
  isTensionCandidate: boolean;
  notSteelReason?: string;
  holes: ExtractedHole[];
  forces: MemberForce[];
}

export interface ExtractedBoltGroup {
  globalId: string;
  expressId: number;
  ifcClass: string;
  name: string | null;
  /** mm */
  nominalDiameter: number | null;
  nominalLength: number | null;
  boltCount: number;
  holeDiameter?: number;
  grade?: string;
  /** World positions of each bolt, mm. */
  positions: Vec3[];
  /** Unit vector of the bolt shanks (world). */
  axis: Vec3;
  memberGlobalIds: string[];
  associatedBy: 'realizing-elements' | 'assembly' | 'geometry' | 'none';
  /** Where boltCount came from: mapped items, the positions list, or a property. */
  countSource: 'mapped-items' | 'property' | 'single';
}

export interface AnalysisEndForce {
  loadCase: string;
  /** Position along the analysis member, mm from its start. */
  location: number;
  /** Force on the member end projected on the member axis, N. */
  axial: number;
  /** Internal axial force implied by this end force, N, tension positive. */
  internalAxial: number;
  /** The force vector as stated in the file, converted to N. */
  force: Vec3;
  coordinates: 'GLOBAL_COORDS' | 'LOCAL_COORDS';
}

export interface ExtractedAnalysisMember {
  globalId: string;
  name: string | null;
  predefinedType: string | null;
  linkedPhysicalGlobalIds: string[];
  /** World mm. */
  start: Vec3 | null;
  end: Vec3 | null;
  endForces: AnalysisEndForce[];
}

export interface ExtractionWarning {
  code: string;
  message: string;
  count: number;
  examples: string[];
}

export interface ExtractedModel {
  schema: IfcSchema;
  /** Header schema string as written (e.g. IFC4X3_ADD2). */
  schemaIdentifier: string;
  units: UnitsInfo;
  project: string | null;
  storeys: StoreyInfo[];
  members: ExtractedMember[];
  boltGroups: ExtractedBoltGroup[];
  analysisMembers: ExtractedAnalysisMember[];
  /** Every parameterised profile definition in the file that maps to a Section (on members or not); empty when read with `listProfiles: false`. */
  profileDefinitions: { expressId: number; ifcClass: string; name: string | null; section: Section }[];
  /** States the force sign convention so consumers need not guess. */
  forceConvention: string;
  warnings: ExtractionWarning[];
  /** Entities per IFC class found in the file (classes relevant to this tool). */
  counts: Record<string, number>;
}

/**
 * Which clues point at a tension member, and which elements are not structural steel at all
 * (detailing exports write nuts, washers and anchors as IfcBeam). The class name alone says
 * little, so several weak clues are combined; each clue found is reported as a string.
 */
import type { Section } from '../../shared/engine/section-types.ts';

const TENSION_TYPES = new Set(['BRACE', 'TIEBAR', 'SUSPENDER', 'STAY_CABLE', 'STRUCTURALCABLE', 'SUSPENSION_CABLE', 'CHORD']);
const TENSION_OBJECT_TYPES = /^(TIE ?ROD|TIEROD|HANGER|TIE|CABLE|ROD|BRACE|BRACING)$/i;
const TENSION_ASSEMBLIES = new Set(['TRUSS', 'BRACED_FRAME', 'CROSS_BRACING']);
const TENSION_ANALYSIS = new Set(['TENSION_MEMBER', 'CABLE']);

/**
 * Words in names. English plus Dutch and German words used for braces, ties, hangers and
 * chords (the corpus is Dutch: 'schoor'/'schoren' = brace(s), 'windverband' = wind bracing,
 * 'trekstang' = tie rod); word starts only, so 'rod' does not fire inside 'product'.
 */
const NAME_WORDS: [RegExp, string][] = [
  [/\b(brace|bracing|braced)/i, 'brace'],
  [/\b(tie ?rod|tie|ties)\b/i, 'tie'],
  [/\b(hanger|hangers|suspender)/i, 'hanger'],
  [/\b(rod|rods)\b/i, 'rod'],
  [/\b(diagonal|diagonaal|diagonale)/i, 'diagonal'],
  [/\b(chord|chords)\b/i, 'chord'],
  [/\b(cable|kabel)/i, 'cable'],
  [/\b(schoor|schoren|windverband|trekstang|trekstaaf|trekker)/i, 'brace (nl)'],
  [/\b(verband|windverband|strebe|zugstange|zugband|h(ä|ae)nger|gurt|abh(ä|ae)nger)/i, 'brace (de)'],
];

/** Fasteners and embedded items written as members: 'MOER_M10' (nut), 'RING_M20' (washer), 'ANKER_M16'. */
const FASTENER_LIKE = /^(MOER|NUT|RING|WASHER|RONDEL|ANKER|ANCHOR|BOUT|BOLT|SCHROEF|SCREW|MUTTER|SCHEIBE)(?:[\s_-]*M\d+.*)?$/i;
const NOT_STEEL_MATERIAL = /(concrete|beton|rubber|timber|wood|hout|holz|glass|glas|masonry|neopreen|neoprene)/i;
const PLATE_NAMES = /^(plaat|plate|gusset|knoopplaat|kopplaat|voetplaat|schetsplaat|platte|blech)$/i;

export interface SignalInput {
  ifcClass: string;
  name: string | null;
  objectType: string | null;
  typeName: string | null;
  predefinedType: string | null;
  profileName: string | null;
  section: Section | null;
  length: number | null;
  materialName: string | null;
  assemblyType: string | null;
  analysisTypes: string[];
}

export function notSteelReason(i: SignalInput): string | undefined {
  for (const n of [i.objectType, i.profileName, i.name]) {
    if (n && FASTENER_LIKE.test(n.trim())) return `fastener or anchor written as ${i.ifcClass} ('${n}')`;
  }
  if (i.materialName && NOT_STEEL_MATERIAL.test(i.materialName)) return `material '${i.materialName}' is not steel`;
  return undefined;
}

function sectionSize(s: Section): number {
  switch (s.shape) {
    case 'flat':
      return s.width;
    case 'angle':
      return Math.max(s.legA, s.legB);
    case 'round-bar':
      return s.diameter;
    case 'chs':
      return s.diameter;
    case 'rhs':
      return Math.max(s.depth, s.width);
    default:
      return Math.max(s.depth, s.flangeWidth);
  }
}

export function tensionSignals(i: SignalInput): { signals: string[]; candidate: boolean; notSteelReason?: string } {
  const strong: string[] = [];
  const pt = i.predefinedType?.toUpperCase() ?? null;
  if (pt && TENSION_TYPES.has(pt)) strong.push(`predefined-type:${pt}`);
  if (pt === 'USERDEFINED' && i.objectType && TENSION_OBJECT_TYPES.test(i.objectType.trim())) strong.push(`object-type:${i.objectType.trim().toUpperCase()}`);
  for (const text of [i.name, i.objectType, i.typeName]) {
    if (!text) continue;
    for (const [re, label] of NAME_WORDS) if (re.test(text) && !strong.includes(`name:${label}`)) strong.push(`name:${label}`);
  }
  if (i.assemblyType && TENSION_ASSEMBLIES.has(i.assemblyType.toUpperCase())) strong.push(`assembly:${i.assemblyType.toUpperCase()}`);
  for (const a of i.analysisTypes) if (TENSION_ANALYSIS.has(a.toUpperCase())) strong.push(`analysis:${a.toUpperCase()}`);

  const weak: string[] = [];
  const shape = i.section?.shape;
  if (shape === 'round-bar' || shape === 'flat' || shape === 'angle') weak.push(`shape:${shape}`);
  // A shape alone is weak (plates are flats too): only slender pieces count.
  const slender = i.section && i.length ? i.length >= 8 * sectionSize(i.section) : false;
  if (weak.length && slender) weak.push('slender');

  const reason = notSteelReason(i);
  const plateLike = i.ifcClass.toUpperCase().startsWith('IFCPLATE') || (i.name !== null && PLATE_NAMES.test(i.name.trim()));
  // Plates sit in trusses and braced frames too; only their own type or name can make them candidates.
  const own = plateLike ? strong.filter((x) => !x.startsWith('assembly:')) : strong;
  const candidate = !reason && (own.length > 0 || (weak.length === 2 && !plateLike));
  return { signals: [...strong, ...weak], candidate, notSteelReason: reason };
}

import type { ChangeKind } from './compare-revisions';

/**
 * How members are coloured by kind of change between two revisions. One colour per kind;
 * a member with several changes takes the colour of the first of its kinds in
 * CHANGE_PRECEDENCE, so the view shows what needs a look soonest (hover and the card still
 * name every change). The same table gives the 3D colour and the key, so they cannot differ.
 */

/**
 * Drawn kinds, most urgent first: a member newly tight or over, then a result that got
 * worse, then a member with no earlier result to lean on, then changes to the member itself
 * (section, grade, holes), then changed analysis forces, and last the good news.
 */
export const CHANGE_PRECEDENCE = ['newly-critical', 'utilisation-up', 'added', 'resized', 'regraded', 'rebolted', 'force-changed', 'utilisation-down'] as const satisfies readonly ChangeKind[];
export type DrawnChangeKind = (typeof CHANGE_PRECEDENCE)[number];

/**
 * Our palette: lightness falls steadily with urgency (about 8–15 L* a step, darkest = most
 * urgent), so grey print still reads "darker needs a look sooner"; hues alternate between
 * warm and cool so neighbours in the list differ for red–green and blue–yellow colour
 * blindness too (checked in change-look.test.ts by simulation). Newly critical members are
 * also outlined in 3D, as over-utilised ones are, so the most urgent kind never rests on colour alone.
 */
export const CHANGE_STYLE: Record<DrawnChangeKind, { colour: string; outlined: boolean }> = {
  'newly-critical': { colour: '#3A1640', outlined: true }, // aubergine, L* 15
  'utilisation-up': { colour: '#7E2A10', outlined: false }, // burnt rust, L* 30
  added: { colour: '#2A6394', outlined: false }, // harbour blue, L* 41
  resized: { colour: '#C0651C', outlined: false }, // copper orange, L* 53
  regraded: { colour: '#5A95C4', outlined: false }, // sky blue, L* 60
  rebolted: { colour: '#D3A230', outlined: false }, // mustard, L* 69
  'force-changed': { colour: '#B3BBEA', outlined: false }, // pale periwinkle, L* 77
  'utilisation-down': { colour: '#F2E6A6', outlined: false }, // pale straw, L* 91
};

/** What a member's changes look like: drawn in one kind's colour, absent (taken out), or unchanged. */
export type ChangeLook = { kind: 'drawn'; shownAs: DrawnChangeKind; colour: string; outlined: boolean } | { kind: 'removed' } | { kind: 'unchanged' };

/** The look of a member from its kinds of change (any order). `removed` wins: the member is not in the newer model, so it cannot be drawn at all. */
export function changeLookOf(kinds: readonly ChangeKind[]): ChangeLook {
  if (kinds.includes('removed')) return { kind: 'removed' };
  const shownAs = CHANGE_PRECEDENCE.find((k) => kinds.includes(k));
  if (!shownAs) return { kind: 'unchanged' };
  return { kind: 'drawn', shownAs, ...CHANGE_STYLE[shownAs] };
}

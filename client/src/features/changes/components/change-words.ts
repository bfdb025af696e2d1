import type { ChangeKind } from '@shared/compare/compare-revisions';

/** How each kind of change reads: as a count heading, and as a word in a member's row. */
export const CHANGE_WORDS: Record<ChangeKind, { heading: string; word: string; hint: string }> = {
  'newly-critical': { heading: 'Now tight or over', word: 'now tight or over', hint: 'Moved into the tight or over band' },
  'utilisation-up': { heading: 'Utilisation higher', word: 'utilisation higher', hint: 'Utilisation rose by more than 0.005' },
  'utilisation-down': { heading: 'Utilisation lower', word: 'utilisation lower', hint: 'Utilisation fell by more than 0.005' },
  added: { heading: 'New members', word: 'new member', hint: 'In this revision only' },
  removed: { heading: 'Taken out', word: 'taken out', hint: 'In the earlier revision only' },
  resized: { heading: 'Section changed', word: 'section changed', hint: 'Different profile name' },
  regraded: { heading: 'Grade changed', word: 'grade changed', hint: 'Different steel grade' },
  rebolted: { heading: 'Holes changed', word: 'holes changed', hint: 'Different hole positions or diameters' },
  'force-changed': { heading: 'Design force changed', word: 'design force changed', hint: 'Differs by more than 0.5 %' },
};

/** The order counts and words appear in: what needs a look first. */
export const KIND_ORDER: ChangeKind[] = ['newly-critical', 'utilisation-up', 'utilisation-down', 'added', 'removed', 'resized', 'regraded', 'rebolted', 'force-changed'];

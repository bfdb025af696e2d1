import { describe, expect, it } from 'vitest';
import { overlayIndexOf, type MemberOverlay } from './member-overlay';
import { overlayLayers } from './overlay-layers';

const overlay: MemberOverlay = {
  title: 'Change since revision 1',
  entries: [
    { id: 'urgent', label: 'urgent', description: '', colour: '#3A1640', outlined: true },
    { id: 'mild', label: 'mild', description: '', colour: '#F2E6A6' },
  ],
  members: new Map([
    ['A', { entry: 'urgent', words: ['a'] }],
    ['B', { entry: 'mild', words: ['b'] }],
    ['Z', { entry: 'mild', words: ['not in this model'] }],
  ]),
  rest: { label: 'unchanged', description: '', words: 'unchanged' },
};
// Scene entries: A and B named, C and E not named, D building context; Z is named but not in the scene.
const ids = ['A', 'B', 'C', 'D', 'E'];
const index = overlayIndexOf(ids, overlay);
const base = { count: ids.length, isContext: (i: number) => i === 3, index, outlined: [true, false], hidden: new Set<number>(), showRest: true, showContext: true, passes: () => true, isolatedOut: () => false };

describe('overlayLayers', () => {
  it('draws named members solid in their entry, the rest faint, and outlines outlined entries', () => {
    expect([...index]).toEqual([0, 1, -1, -1, -1]);
    const l = overlayLayers(base);
    expect(l).toMatchObject({ main: [0, 1], ghost: [2, 4], context: [3], over: [0], counts: [1, 1], rest: 2, contextCount: 1 });
  });

  it('moves hidden or filtered-out entries to the faint layer, and drops the faint layer when asked', () => {
    expect(overlayLayers({ ...base, hidden: new Set([0]) })).toMatchObject({ main: [1], ghost: [0, 2, 4], over: [] });
    expect(overlayLayers({ ...base, passes: (i) => i !== 1 })).toMatchObject({ main: [0], ghost: [1, 2, 4] });
    expect(overlayLayers({ ...base, showRest: false, showContext: false })).toMatchObject({ main: [0, 1], ghost: [], context: [], counts: [1, 1] });
    expect(overlayLayers({ ...base, isolatedOut: (i) => i !== 1 })).toMatchObject({ main: [1], ghost: [], over: [] });
  });
});

import { describe, expect, it } from 'vitest';
import { parseSectionName } from './section-names.ts';
import { rolledSection } from './rolled-sections.ts';

describe('parseSectionName: angles', () => {
  it.each([
    ['L200/200/24', 200, 200, 24],
    ['L65/130/8', 65, 130, 8],
    ['L150/100/10', 150, 100, 10],
    ['HOEK 50 X 50 X 5', 50, 50, 5],
    ['L50x50x5', 50, 50, 5],
    ['EA 75x75x6', 75, 75, 6],
    ['UA 100x75x8', 100, 75, 8],
    ['L100/10', 100, 100, 10],
  ])('%s', (name, a, b, t) => {
    expect(parseSectionName(name)).toEqual({ shape: 'angle', legA: a, legB: b, thickness: t });
  });

  it('converts inch angles (L4X4X1/2)', () => {
    expect(parseSectionName('L4X4X1/2')).toEqual({ shape: 'angle', legA: 101.6, legB: 101.6, thickness: 12.7 });
  });
});

describe('parseSectionName: flats', () => {
  it.each([
    ['STRIP100x10'], ['Strip 100x10'], ['FL100x10'], ['PL10x100'], ['FLAT 100x10'], ['STRIP10*100'],
  ])('%s is a 100 × 10 flat', (name) => {
    expect(parseSectionName(name)).toEqual({ shape: 'flat', width: 100, thickness: 10 });
  });
  it('reads thickness*width names from detailing exports', () => {
    expect(parseSectionName('STRIP15*220')).toEqual({ shape: 'flat', width: 220, thickness: 15 });
  });
});

describe('parseSectionName: round bars, tubes and hollow sections', () => {
  it.each([['R10', 10], ['R20', 20], ['RD20', 20], ['ROD M20', 20], ['Ø20', 20]])('%s', (name, d) => {
    expect(parseSectionName(name)).toEqual({ shape: 'round-bar', diameter: d });
  });
  it.each([
    ['B152.4/12.5', 152.4, 12.5],
    ['CHS 114.3x6.0', 114.3, 6],
  ])('%s', (name, d, t) => {
    expect(parseSectionName(name)).toEqual({ shape: 'chs', diameter: d, thickness: t });
  });
  it.each([
    ['K70/70/4', 70, 70, 4],
    ['K80/4', 80, 80, 4],
    ['SHS 100x100x5', 100, 100, 5],
    ['RHS 150x100x6', 150, 100, 6],
  ])('%s', (name, h, b, t) => {
    expect(parseSectionName(name)).toEqual({ shape: 'rhs', depth: h, width: b, thickness: t });
  });
});

describe('parseSectionName: rolled sections from the table', () => {
  it('HEB220', () => {
    expect(parseSectionName('HEB220')).toEqual({ shape: 'i', depth: 220, flangeWidth: 220, webThickness: 9.5, flangeThickness: 16, rootRadius: 18 });
  });
  it('spelling variants map to the same row', () => {
    expect(parseSectionName('HE 220 B')).toEqual(parseSectionName('HEB220'));
    expect(parseSectionName('IPE 200')).toEqual(rolledSection('IPE', '200'));
    expect(parseSectionName('HEA180')?.shape).toBe('i');
  });
  it('channels', () => {
    expect(parseSectionName('UPN200')).toMatchObject({ shape: 'channel', depth: 200, flangeWidth: 75 });
    expect(parseSectionName('PFC 200x90x30')).toMatchObject({ shape: 'channel', depth: 200, flangeWidth: 90 });
  });
  it('British and US designations (US converted from inches)', () => {
    expect(parseSectionName('UB 305x165x40')).toMatchObject({ shape: 'i', depth: 303.4 });
    expect(parseSectionName('305x165x40UB')).toMatchObject({ shape: 'i', depth: 303.4 });
    expect(parseSectionName('W10X30')).toMatchObject({ shape: 'i', depth: 266.7, flangeWidth: 147.57 });
    expect(parseSectionName('C10X20')).toMatchObject({ shape: 'channel', depth: 254 });
  });
});

describe('parseSectionName: unknown names', () => {
  it.each([['MOER_M10'], ['RING_M20'], ['ANKER_M16'], ['HEB999'], ['SketchProfile'], [''], ['L'], ['1/2IPE300']])(
    '%s → null',
    (name) => {
      expect(parseSectionName(name)).toBeNull();
    },
  );
  it('null and undefined', () => {
    expect(parseSectionName(null)).toBeNull();
    expect(parseSectionName(undefined)).toBeNull();
  });
});

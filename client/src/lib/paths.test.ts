import { describe, expect, it } from 'vitest';
import { paths, safeReturnPath } from './paths';

describe('safeReturnPath', () => {
  it('keeps paths inside the app', () => {
    expect(safeReturnPath('/projects/3')).toBe('/projects/3');
    expect(safeReturnPath('/admin/people?x=1#top')).toBe('/admin/people?x=1#top');
  });

  it('refuses anything that could leave the app, or loop back to sign-in', () => {
    for (const bad of [null, undefined, '', 'https://evil.test/', '//evil.test/x', '/\\evil.test', 'javascript:alert(1)', '/sign-in', '/sign-in?next=/x']) {
      expect(safeReturnPath(bad)).toBe(paths.home);
    }
  });
});

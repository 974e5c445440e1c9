import { teamIdFromUrl } from './team-switcher';

describe('teamIdFromUrl', () => {
  it.each([
    ['/teams/abc', 'abc'],
    ['/teams/abc?x=1', 'abc'],
    ['/teams/a%20b/members', 'a b'],
    ['/teams', null],
    ['/plans/abc', null],
  ])('%s → %s', (url, expected) => {
    expect(teamIdFromUrl(url)).toBe(expected);
  });
});

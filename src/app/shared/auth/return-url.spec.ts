import { safeReturnUrl } from './return-url';

describe('safeReturnUrl', () => {
  it.each([
    ['/teams/t1', '/teams/t1'],
    ['/invitations/abc?x=1', '/invitations/abc?x=1'],
  ])('%s → kept', (value, expected) => {
    expect(safeReturnUrl(value)).toBe(expected);
  });

  it.each([
    ['https://evil.example/x'],
    ['//evil.example/x'],
    ['/\\evil.example'],
    ['javascript:alert(1)'],
    ['/sign-in?returnUrl=/x'],
    ['/register'],
    [''],
  ])('%s → fallback /teams', (value) => {
    expect(safeReturnUrl(value)).toBe('/teams');
  });

  it('undefined with a custom fallback → that fallback', () => {
    expect(safeReturnUrl(undefined, '')).toBe('');
  });
});

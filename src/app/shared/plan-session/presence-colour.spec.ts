import { initials, inkOn, presenceColour } from './presence-colour';

describe('presence colours and initials', () => {
  it('presenceColour(same id) → same #rrggbb every time', () => {
    expect(presenceColour('u-ana')).toBe(presenceColour('u-ana'));
    expect(presenceColour('u-ana')).toMatch(/^#[0-9a-f]{6}$/);
  });

  it('presenceColour over 50 ids → uses at least 5 of the 7 palette colours', () => {
    const ids = Array.from({ length: 50 }, (_, i) => `0000000${i}-aaaa-4bbb-8ccc-ddddeeeeffff`);
    expect(new Set(ids.map(presenceColour)).size).toBeGreaterThanOrEqual(5);
  });

  it('initials("Ana Maria Rocha") → "AR"; one word → first two letters; blank → "?"', () => {
    expect(initials('Ana Maria Rocha')).toBe('AR');
    expect(initials('eddie')).toBe('ED');
    expect(initials('   ')).toBe('?');
  });
});

describe('inkOn', () => {
  it('inkOn(dark blue #0072b2) → white; inkOn(yellow #f0e442) → black', () => {
    // WCAG 2.x contrast: #0072b2 vs white ≈ 5.2:1 (computed by hand from the luminance formula).
    expect(inkOn('#0072b2')).toBe('#ffffff');
    expect(inkOn('#f0e442')).toBe('#000000');
    expect(inkOn('#000000')).toBe('#ffffff');
  });
});

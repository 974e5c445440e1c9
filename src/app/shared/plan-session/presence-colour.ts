/**
 * Presence colours: a fixed set that stays distinguishable under the common colour-vision
 * deficiencies (the Okabe–Ito palette), always shown beside the user's initials, never alone.
 */
const PALETTE = ['#0072b2', '#e69f00', '#009e73', '#cc79a7', '#d55e00', '#56b4e9', '#f0e442'];

/** A stable colour for a user id. */
export function presenceColour(userId: string): string {
  // FNV-1a: spreads similar ids (uuids differing in a few digits) across the palette.
  let h = 0x811c9dc5;
  for (let i = 0; i < userId.length; i++) h = Math.imul(h ^ userId.charCodeAt(i), 0x01000193) >>> 0;
  return PALETTE[h % PALETTE.length];
}

/** Up to two initials of a display name ("Ana Rocha" → "AR"). */
export function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  if (parts.length === 0) return '?';
  const letters = parts.length === 1 ? parts[0].slice(0, 2) : parts[0][0] + parts.at(-1)![0];
  return letters.toUpperCase();
}

/**
 * Black or white, whichever contrasts more with `colour` (#rrggbb), by the WCAG 2.x relative
 * luminance and contrast-ratio formulas.
 */
export function inkOn(colour: string): '#000000' | '#ffffff' {
  const channel = (i: number) => {
    const c = parseInt(colour.slice(i, i + 2), 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  const l = 0.2126 * channel(1) + 0.7152 * channel(3) + 0.0722 * channel(5);
  // Contrast with black is (l + 0.05) / 0.05, with white 1.05 / (l + 0.05).
  return (l + 0.05) / 0.05 >= 1.05 / (l + 0.05) ? '#000000' : '#ffffff';
}

import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';

const dist = path.resolve(__dirname, '../../dist/web/browser');

/** Every http(s) URL in a text, minus XML namespace identifiers (not fetched by browsers). */
function externalUrls(text: string): string[] {
  const urls = text.match(/https?:\/\/[^\s"'`)<>]+/g) ?? [];
  return urls.filter((u) => !/^http:\/\/www\.w3\.org\//.test(u));
}

describe('built client', () => {
  test('index.html and every CSS file → no reference to an external host', () => {
    let files: string[];
    try {
      files = readdirSync(dist);
    } catch {
      throw new Error(`No built client in ${dist}: run through \`npm test\` (it builds it first)`);
    }
    const checked = files.filter((f) => f === 'index.html' || f.endsWith('.css'));
    expect(checked).toContain('index.html');
    expect(checked.some((f) => f.endsWith('.css'))).toBe(true);
    const offenders = checked.flatMap((f) =>
      externalUrls(readFileSync(path.join(dist, f), 'utf8')).map((u) => `${f}: ${u}`),
    );
    expect(offenders).toEqual([]);
  });

  test('fonts and icons → shipped as files inside the build', () => {
    const media = readdirSync(path.join(dist, 'media'));
    expect(media.some((f) => /atkinson-hyperlegible.*\.woff2$/.test(f))).toBe(true);
    expect(media.some((f) => /material-symbols-outlined.*\.woff2$/.test(f))).toBe(true);
  });
});

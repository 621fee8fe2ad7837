import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { create } from 'fontkit';
import { pdfFonts, splitRuns, woffToSfnt } from './pdf-fonts.js';
import { REPO_ROOT } from './repo-root.js';

describe('woffToSfnt', () => {
  it('unwraps a WOFF into a font with the same glyphs and names', () => {
    const woff = readFileSync(join(REPO_ROOT, 'fonts/ibm-plex-sans-400.woff'));
    const fromWoff = create(woff) as unknown as { numGlyphs: number; postscriptName: string };
    const sfnt = woffToSfnt(woff);
    const fromSfnt = create(sfnt) as unknown as { numGlyphs: number; postscriptName: string };
    expect(sfnt.readUInt32BE(0)).toBe(woff.readUInt32BE(4)); // the WOFF's flavor
    expect(fromSfnt.numGlyphs).toBe(fromWoff.numGlyphs);
    expect(fromSfnt.postscriptName).toBe(fromWoff.postscriptName);
  });

  it('refuses what is not a WOFF 1.0 file', () => {
    expect(() => woffToSfnt(readFileSync(join(REPO_ROOT, 'fonts/ibm-plex-mono-400.ttf')))).toThrow(
      'Not a WOFF 1.0 font',
    );
  });
});

describe('splitRuns', () => {
  const faces = pdfFonts().sans[400];
  const names = (text: string) => splitRuns(text, faces).map((r) => [r.face.name, r.text]);

  it('keeps Latin-1 text in the first face, in one run', () => {
    expect(names('Zoë Müller, 1.4 GHz ±2″')).toEqual([['sans-400', 'Zoë Müller, 1.4 GHz ±2″']]);
  });

  it('draws letters beyond Latin-1 from the other subsets of the family', () => {
    expect(names('Ngũgĩ-Łukasik')).toEqual([
      ['sans-400', 'Ng'],
      ['sans-400-latin-ext', 'ũ'],
      ['sans-400', 'g'],
      ['sans-400-latin-ext', 'ĩ'],
      ['sans-400', '-'],
      ['sans-400-latin-ext', 'Ł'],
      ['sans-400', 'ukasik'],
    ]);
    expect(names('Σοφία')[0]).toEqual(['sans-400-greek', 'Σοφία']);
  });

  it('draws a character no face has in its compatibility form, else as "?"', () => {
    // U+01C5 (Dž) is in no subset; its compatibility form is D + ž. U+4E00 has no form at all.
    expect(
      splitRuns('ǅ一', faces)
        .map((r) => r.text)
        .join(''),
    ).toBe('Dž?');
  });
});

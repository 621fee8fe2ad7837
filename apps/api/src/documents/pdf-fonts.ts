import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { inflateSync } from 'node:zlib';
import { create, type Font } from 'fontkit';
import { REPO_ROOT } from './repo-root.js';

export type SansWeight = 400 | 500 | 600 | 700;

/** One font, parsed once per process and shared by every PDF (pdfkit takes a parsed font). */
export interface FontFace {
  /** The name it is registered under in each pdfkit document. */
  name: string;
  font: Font;
}

export interface PdfFonts {
  /** Per weight, the faces to try in order for each character. */
  sans: Record<SansWeight, FontFace[]>;
  mono: FontFace[];
}

/** A run of text that one face draws. */
export interface TextRun {
  face: FontFace;
  text: string;
}

const WEIGHTS: SansWeight[] = [400, 500, 600, 700];
/**
 * fonts/ ships IBM Plex Sans' latin subset only. Names such as "Zoë Ngũgĩ-Łukasik" need the other
 * subsets of the same family, which come from the @fontsource package (OFL, its LICENSE beside
 * the files), tried in this order after latin, the way a browser walks unicode-range faces.
 */
const EXTRA_SUBSETS = ['latin-ext', 'vietnamese', 'greek', 'cyrillic', 'cyrillic-ext'] as const;

const require = createRequire(import.meta.url);

function load(): PdfFonts {
  const fontsDir = join(REPO_ROOT, 'fonts');
  const face = (name: string, path: string): FontFace => {
    const bytes = readFileSync(path);
    return { name, font: create(path.endsWith('.woff') ? woffToSfnt(bytes) : bytes) };
  };
  const sans = {} as Record<SansWeight, FontFace[]>;
  for (const weight of WEIGHTS) {
    sans[weight] = [
      face(`sans-${weight}`, join(fontsDir, `ibm-plex-sans-${weight}.woff`)),
      ...EXTRA_SUBSETS.map((subset) =>
        face(
          `sans-${weight}-${subset}`,
          require.resolve(
            `@fontsource/ibm-plex-sans/files/ibm-plex-sans-${subset}-${weight}-normal.woff`,
          ),
        ),
      ),
    ];
  }
  // The Mono draws only references and codes (ASCII); the TTF, not the WOFF (see fonts/README.md).
  const mono = [face('mono-400', join(fontsDir, 'ibm-plex-mono-400.ttf'))];
  return { sans, mono };
}

/**
 * Unwraps a WOFF 1.0 file into the TrueType/OpenType font inside it (W3C WOFF 1.0, sections 4-5):
 * each table inflated, laid out with a plain table directory, nothing else changed. fontkit reads
 * WOFF itself, but inflates its tables in JavaScript, again whenever it reads one: unwrapped once
 * here with zlib, a cover takes a fraction of the time.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) throw new Error('Not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables = Array.from({ length: numTables }, (_, i) => {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const stored = woff.subarray(offset, offset + compLength);
    return {
      tag: woff.readUInt32BE(at),
      checksum: woff.readUInt32BE(at + 16),
      data: compLength < origLength ? inflateSync(stored) : stored,
    };
  });
  const padded = (n: number) => (n + 3) & ~3;
  const headerLength = 12 + 16 * numTables;
  const out = Buffer.alloc(
    headerLength + tables.reduce((sum, t) => sum + padded(t.data.length), 0),
  );
  const log2 = Math.floor(Math.log2(numTables));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(16 * 2 ** log2, 6);
  out.writeUInt16BE(log2, 8);
  out.writeUInt16BE(16 * numTables - 16 * 2 ** log2, 10);
  let offset = headerLength;
  tables.forEach((t, i) => {
    const at = 12 + 16 * i;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += padded(t.data.length);
  });
  return out;
}

let cached: PdfFonts | undefined;

/**
 * The fonts, read and parsed once per process: parsing them again for every PDF would cost more
 * than drawing the whole cover.
 */
export function pdfFonts(): PdfFonts {
  cached ??= load();
  return cached;
}

const covers = (face: FontFace, codePoint: number) => face.font.hasGlyphForCodePoint(codePoint);

/**
 * Splits text into runs, each drawn by the first face that has its characters. A character no
 * face has is drawn as its compatibility form when the faces have that ("ǅ" → "Dž"), else as its
 * letters without accents, else as "?", so a cover never shows an empty box.
 */
export function splitRuns(text: string, faces: FontFace[]): TextRun[] {
  const primary = faces[0];
  if (!primary) throw new Error('splitRuns needs at least one face');
  const faceFor = (char: string) => faces.find((f) => covers(f, char.codePointAt(0) ?? 0));
  const drawable = (s: string) => s !== '' && [...s].every((c) => faceFor(c));
  const runs: TextRun[] = [];
  const push = (face: FontFace, char: string) => {
    const last = runs[runs.length - 1];
    if (last && last.face === face) last.text += char;
    else runs.push({ face, text: char });
  };
  for (const char of text.normalize('NFC')) {
    const face = faceFor(char);
    if (face) {
      push(face, char);
      continue;
    }
    const substitute = [char.normalize('NFKC'), char.normalize('NFKD').replace(/\p{M}/gu, '')].find(
      drawable,
    );
    for (const c of substitute ?? '?') push(faceFor(c) ?? primary, c);
  }
  return runs;
}

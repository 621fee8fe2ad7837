import type PDFDocument from 'pdfkit';
import { type FontFace, type PdfFonts, type SansWeight, splitRuns } from './pdf-fonts.js';

type Doc = InstanceType<typeof PDFDocument>;

/** What pdfkit keeps of the current font: the layout of each word it has shaped. */
interface EmbeddedFontState {
  layoutCache?: Record<string, unknown>;
}

/**
 * Word layouts shared by every document, per font. pdfkit shapes each word once per document
 * (kerning, ligatures: most of a cover's CPU time); a layout depends only on the font and the
 * word, so covers can share them. Bounded: a cache past 20,000 words starts afresh.
 */
const sharedLayouts = new WeakMap<object, Record<string, unknown>>();
const MAX_SHARED_WORDS = 20_000;

export interface TextStyle {
  size: number;
  weight?: SansWeight;
  /** IBM Plex Mono (ASCII codes and references). */
  mono?: boolean;
  color?: string;
  lineGap?: number;
  align?: 'left' | 'right' | 'center';
  /** Extra space between letters, for small capitals-like labels. */
  characterSpacing?: number;
}

/**
 * Draws text with pdfkit in IBM Plex, switching to another subset of the family for characters
 * the first one lacks (see pdf-fonts.ts). Positions are absolute; callers lay out the page.
 */
export class Typesetter {
  private readonly adopted = new Set<FontFace>();

  constructor(
    readonly doc: Doc,
    private readonly fonts: PdfFonts,
  ) {
    const faces = [...Object.values(fonts.sans).flat(), ...fonts.mono];
    // pdfkit also takes an already parsed fontkit font (it checks for `layout`), though its
    // types list byte sources only.
    for (const face of faces) doc.registerFont(face.name, face.font as unknown as Buffer);
  }

  /** Makes `face` the current font, using the shared word layouts. */
  private use(face: FontFace): Doc {
    this.doc.font(face.name);
    if (!this.adopted.has(face)) {
      this.adopted.add(face);
      // pdfkit's own field (not in its types); without it, each document simply shapes anew.
      const current = (this.doc as unknown as { _font?: EmbeddedFontState })._font;
      if (current?.layoutCache) {
        let shared = sharedLayouts.get(face.font);
        if (!shared || Object.keys(shared).length > MAX_SHARED_WORDS) {
          shared = Object.create(null) as Record<string, unknown>;
          sharedLayouts.set(face.font, shared);
        }
        current.layoutCache = shared;
      }
    }
    return this.doc;
  }

  private faces(style: TextStyle): FontFace[] {
    return style.mono ? this.fonts.mono : this.fonts.sans[style.weight ?? 400];
  }

  /** No `features` here: pdfkit caches word layouts only for text without them (even `[]`). */
  private options(style: TextStyle, width?: number): PDFKit.Mixins.TextOptions {
    return {
      width,
      lineGap: style.lineGap ?? 0,
      align: style.align ?? 'left',
      characterSpacing: style.characterSpacing ?? 0,
    };
  }

  /** The height `text` takes in `width` (measured in the first face: the subsets share metrics). */
  heightOf(text: string, width: number, style: TextStyle): number {
    const face = this.faces(style)[0]!;
    return this.use(face).fontSize(style.size).heightOfString(text, this.options(style, width));
  }

  widthOf(text: string, style: TextStyle): number {
    let width = 0;
    for (const run of splitRuns(text, this.faces(style))) {
      width += this.use(run.face).fontSize(style.size).widthOfString(run.text, this.options(style));
    }
    return width;
  }

  /** Draws `text` at (x, y), wrapped to `width` when given; returns the height it took. */
  text(text: string, x: number, y: number, style: TextStyle, width?: number): number {
    const doc = this.doc.fontSize(style.size).fillColor(style.color ?? '#000000');
    const runs = splitRuns(text, this.faces(style));
    const options = this.options(style, width);
    if (runs.length <= 1) {
      this.use(runs[0]?.face ?? this.faces(style)[0]!).text(runs[0]?.text ?? '', x, y, {
        ...options,
        lineBreak: width !== undefined,
      });
    } else {
      // pdfkit keeps wrapping across font changes when each piece is `continued`.
      runs.forEach((run, i) => {
        const more = { ...options, lineBreak: width !== undefined, continued: i < runs.length - 1 };
        this.use(run.face);
        if (i === 0) doc.text(run.text, x, y, more);
        else doc.text(run.text, more);
      });
    }
    return doc.y - y;
  }
}

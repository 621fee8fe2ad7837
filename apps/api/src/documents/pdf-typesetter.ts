import type PDFDocument from 'pdfkit';
import { type FontFace, type PdfFonts, type SansWeight, splitRuns } from './pdf-fonts.js';

type Doc = InstanceType<typeof PDFDocument>;

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
  /** Tabular figures, so digits line up in columns. */
  tabular?: boolean;
}

/**
 * Draws text with pdfkit in IBM Plex, switching to another subset of the family for characters
 * the first one lacks (see pdf-fonts.ts). Positions are absolute; callers lay out the page.
 */
export class Typesetter {
  constructor(
    readonly doc: Doc,
    private readonly fonts: PdfFonts,
  ) {
    const faces = [...Object.values(fonts.sans).flat(), ...fonts.mono];
    // pdfkit also takes an already parsed fontkit font (it checks for `layout`), though its
    // types list byte sources only.
    for (const face of faces) doc.registerFont(face.name, face.font as unknown as Buffer);
  }

  private faces(style: TextStyle): FontFace[] {
    return style.mono ? this.fonts.mono : this.fonts.sans[style.weight ?? 400];
  }

  private options(style: TextStyle, width?: number): PDFKit.Mixins.TextOptions {
    return {
      width,
      lineGap: style.lineGap ?? 0,
      align: style.align ?? 'left',
      characterSpacing: style.characterSpacing ?? 0,
      features: style.tabular ? ['tnum'] : [],
    };
  }

  /** The height `text` takes in `width` (measured in the first face: the subsets share metrics). */
  heightOf(text: string, width: number, style: TextStyle): number {
    const face = this.faces(style)[0]!;
    return this.doc
      .font(face.name)
      .fontSize(style.size)
      .heightOfString(text, this.options(style, width));
  }

  widthOf(text: string, style: TextStyle): number {
    let width = 0;
    for (const run of splitRuns(text, this.faces(style))) {
      width += this.doc
        .font(run.face.name)
        .fontSize(style.size)
        .widthOfString(run.text, this.options(style));
    }
    return width;
  }

  /** Draws `text` at (x, y), wrapped to `width` when given; returns the height it took. */
  text(text: string, x: number, y: number, style: TextStyle, width?: number): number {
    const doc = this.doc.fontSize(style.size).fillColor(style.color ?? '#000000');
    const runs = splitRuns(text, this.faces(style));
    const options = this.options(style, width);
    if (runs.length <= 1) {
      doc.font(runs[0]?.face.name ?? this.faces(style)[0]!.name).text(runs[0]?.text ?? '', x, y, {
        ...options,
        lineBreak: width !== undefined,
      });
    } else {
      // pdfkit keeps wrapping across font changes when each piece is `continued`.
      runs.forEach((run, i) => {
        const more = { ...options, lineBreak: width !== undefined, continued: i < runs.length - 1 };
        doc.font(run.face.name);
        if (i === 0) doc.text(run.text, x, y, more);
        else doc.text(run.text, more);
      });
    }
    return doc.y - y;
  }
}

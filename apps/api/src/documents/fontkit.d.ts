/** The part of fontkit 2 (pdfkit's font reader) that Skyhours uses; the package has no types. */
declare module 'fontkit' {
  export interface Font {
    postscriptName: string;
    hasGlyphForCodePoint(codePoint: number): boolean;
    /** pdfkit accepts a parsed font wherever it takes font bytes (it checks for `layout`). */
    layout(text: string, features?: unknown): unknown;
  }
  export function create(buffer: Uint8Array, postscriptName?: string): Font;
}

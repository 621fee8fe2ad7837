import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

type PdfJs = typeof import('pdfjs-dist/legacy/build/pdf.mjs');

let pdfjs: Promise<PdfJs> | undefined;
/** Loaded on first use: only anonymous calls read text, and pdf.js is large. */
const loadPdfJs = () => (pdfjs ??= import('pdfjs-dist/legacy/build/pdf.mjs'));

const require = createRequire(import.meta.url);
/** pdf.js reads the metrics of the 14 standard fonts from here (a folder path with a slash). */
const STANDARD_FONTS =
  join(dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts') + '/';

/** pdf.js' VerbosityLevel.ERRORS: its warnings about odd files would fill the server log. */
const ERRORS_ONLY = 0;

/**
 * The text of each page, in reading order as pdf.js gives it, lines ended by "\n". Rejects when
 * the file cannot be parsed or `timeoutMs` passes; the caller decides what that means.
 */
export async function extractPageTexts(bytes: Uint8Array, timeoutMs: number): Promise<string[]> {
  const { getDocument } = await loadPdfJs();
  const task = getDocument({
    // A copy: pdf.js takes over (detaches) the buffer it is given.
    data: new Uint8Array(bytes),
    standardFontDataUrl: STANDARD_FONTS,
    isEvalSupported: false,
    useSystemFonts: false,
    disableFontFace: true,
    stopAtErrors: false,
    verbosity: ERRORS_ONLY,
  });
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(
      () => reject(new Error(`text extraction took over ${timeoutMs} ms`)),
      timeoutMs,
    );
  });
  try {
    return await Promise.race([readPages(task.promise), timeout]);
  } finally {
    clearTimeout(timer);
    await task.destroy().catch(() => undefined);
  }
}

async function readPages(loading: ReturnType<PdfJs['getDocument']>['promise']): Promise<string[]> {
  const pdf = await loading;
  const pages: string[] = [];
  for (let n = 1; n <= pdf.numPages; n++) {
    const page = await pdf.getPage(n);
    const content = await page.getTextContent();
    pages.push(
      content.items
        .map((item) => ('str' in item ? item.str + (item.hasEOL ? '\n' : '') : ''))
        .join(''),
    );
    page.cleanup();
  }
  return pages;
}

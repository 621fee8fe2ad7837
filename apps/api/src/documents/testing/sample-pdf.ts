import PDFDocument from 'pdfkit';
import { pdfFonts } from '../pdf-fonts.js';
import { Typesetter } from '../pdf-typesetter.js';

/**
 * PDFs made on the spot for the tests and the benchmark, so no binary science case is committed.
 * Each string of `pages` is one page's text; `font: 'helvetica'` uses a standard PDF font (no
 * embedding), 'plex' embeds IBM Plex with its other subsets (for names beyond Latin-1).
 */
export async function samplePdf(
  pages: string[],
  options: { font?: 'helvetica' | 'plex'; figure?: boolean; title?: string } = {},
): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 60, autoFirstPage: false });
  if (options.title) doc.info.Title = options.title;
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const ended = new Promise<void>((resolve) => doc.on('end', resolve));
  const ts = options.font === 'plex' ? new Typesetter(doc, pdfFonts()) : null;
  for (const text of pages) {
    doc.addPage();
    if (ts) ts.text(text, 60, 60, { size: 11, lineGap: 3 }, 475);
    else doc.font('Helvetica').fontSize(11).text(text, 60, 60, { width: 475, lineGap: 3 });
    if (options.figure) drawFigure(doc, 60, doc.y + 20);
  }
  doc.end();
  await ended;
  return Buffer.concat(chunks);
}

/** A small line plot with axes, like a figure of a science case (vector paths and a label). */
function drawFigure(doc: InstanceType<typeof PDFDocument>, x: number, y: number): void {
  const w = 300;
  const h = 150;
  doc.lineWidth(0.8).strokeColor('#333333');
  doc
    .moveTo(x, y)
    .lineTo(x, y + h)
    .lineTo(x + w, y + h)
    .stroke();
  doc.moveTo(x, y + h);
  for (let i = 0; i <= 60; i++) {
    const t = i / 60;
    doc.lineTo(x + t * w, y + h - h * (0.1 + 0.8 * Math.exp(-((t - 0.45) ** 2) / 0.02)));
  }
  doc.strokeColor('#2a3f71').stroke();
  doc.font('Helvetica').fontSize(8).fillColor('#333333');
  doc.text('Figure 1. Expected line profile (invented).', x, y + h + 6);
}

/** About a page of invented science-case prose. */
export const SCIENCE_PROSE =
  'The filament is seen in the optical as a faint bridge between two groups of galaxies. ' +
  'If the gas is being compressed as it falls towards the groups, the neutral hydrogen should ' +
  'show a velocity gradient of a few tens of kilometres per second along its length, and the ' +
  'rotation measures of background sources should rise towards the spine of the filament. ' +
  'Our simulations predict both signatures at levels the requested observations can reach. ' +
  'The compact configuration recovers the largest scales of the emission, while the extended ' +
  'configuration resolves the background sources and separates their polarised components. ' +
  'We have chosen the bandwidths so that the spectral resolution samples the expected line ' +
  'widths with at least three channels, and the mosaic covers the filament with Nyquist ' +
  'spacing of the primary beam. The calibration plan follows the observatory guidelines. ';

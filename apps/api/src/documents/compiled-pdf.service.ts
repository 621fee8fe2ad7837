import { Injectable, type OnModuleInit } from '@nestjs/common';
import { PDFArray, PDFDict, PDFDocument, PDFName, type PDFPage, PDFRef } from 'pdf-lib';
import type { ProposalSnapshot } from '../proposals/proposal-snapshot.js';
import { drawCover } from './cover-sheet.js';
import { pdfFonts } from './pdf-fonts.js';

/**
 * The compiled PDF of a submitted version: a cover drawn from the snapshot, then the science
 * case's pages. Referees read this one file; the proposals module stores its bytes with the
 * version.
 */
@Injectable()
export class CompiledPdfService implements OnModuleInit {
  /** Reads the fonts at start: a missing file fails the start, not a submission. */
  onModuleInit(): void {
    pdfFonts();
  }

  /**
   * `scienceCase` must be a PDF that ScienceCaseService.inspect() accepted (an unreadable one
   * throws: it is the server's data, not the user's input). In an anonymous call
   * (`snapshot.call.anonymous`) neither the cover nor the document's metadata names the team.
   */
  async compile(snapshot: ProposalSnapshot, scienceCase: Buffer | null): Promise<Buffer> {
    const source = scienceCase
      ? await PDFDocument.load(scienceCase, { updateMetadata: false })
      : null;
    const scienceCasePages = source?.getPageCount() ?? 0;
    const cover = await drawCover(snapshot, pdfFonts(), { scienceCasePages });
    const out = await PDFDocument.load(cover.bytes, { updateMetadata: false });
    if (source) {
      const pages = await out.copyPages(source, source.getPageIndices());
      for (const page of pages) {
        if (snapshot.call.anonymous) removeAuthorship(page);
        out.addPage(page);
      }
    }
    setMetadata(out, snapshot);
    return Buffer.from(await out.save());
  }
}

/**
 * Only pages are copied, so the science case's own metadata (its Info and XMP, where authoring
 * software writes the author's name) never reaches the compiled PDF. Pages can carry some too:
 * a page's XMP, and the author (/T) of each comment annotation.
 */
function removeAuthorship(page: PDFPage): void {
  page.node.delete(PDFName.of('Metadata'));
  page.node.delete(PDFName.of('PieceInfo'));
  const annots = page.node.lookupMaybe(PDFName.of('Annots'), PDFArray);
  for (let i = 0; i < (annots?.size() ?? 0); i++) {
    annots?.lookupMaybe(i, PDFDict)?.delete(PDFName.of('T'));
  }
}

/** The Info dictionary is the one source: pdfkit's XMP packet (its own name, today's date) goes. */
function setMetadata(pdf: PDFDocument, s: ProposalSnapshot): void {
  const xmp = pdf.catalog.get(PDFName.of('Metadata'));
  if (xmp instanceof PDFRef) pdf.context.delete(xmp);
  pdf.catalog.delete(PDFName.of('Metadata'));
  const submitted = new Date(s.submittedAt);
  pdf.setTitle(`${s.reference}: ${s.title}`, { showInWindowTitleBar: true });
  pdf.setSubject(`Proposal to call ${s.call.code} (${s.call.title}), version ${s.version}`);
  pdf.setKeywords([s.reference, s.call.code, s.scienceCategory]);
  // pdfkit writes no Author, so in an anonymous call the compiled PDF has none.
  if (!s.call.anonymous) {
    const pi = s.team.find((m) => m.role === 'pi') ?? s.team[0];
    const others = s.team.length - (pi ? 1 : 0);
    if (pi) pdf.setAuthor(others > 0 ? `${pi.name} and ${others} more` : pi.name);
  }
  pdf.setCreator('Skyhours');
  pdf.setProducer('Skyhours');
  pdf.setLanguage('en');
  if (!Number.isNaN(submitted.getTime())) {
    pdf.setCreationDate(submitted);
    pdf.setModificationDate(submitted);
  }
}

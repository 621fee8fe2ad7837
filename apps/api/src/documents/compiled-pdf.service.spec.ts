import { PDFArray, PDFDict, PDFDocument, PDFName, PDFString } from 'pdf-lib';
import { CompiledPdfService } from './compiled-pdf.service.js';
import { extractPageTexts } from './pdf-text.js';
import { foldText } from './team-names.js';
import { SCIENCE_PROSE, samplePdf } from './testing/sample-pdf.js';
import { SAMPLE_TEAM, sampleSnapshot } from './testing/sample-snapshot.js';

const service = new CompiledPdfService();
const textOf = async (pdf: Buffer) => (await extractPageTexts(pdf, 20_000)).join('\n');

describe('CompiledPdfService.compile', () => {
  let scienceCase: Buffer;
  beforeAll(async () => {
    scienceCase = await samplePdf(
      [1, 2, 3, 4].map((n) => `SCIENCE CASE PAGE ${n}\n${SCIENCE_PROSE}`),
      { figure: true, title: 'My science case by Ada Quill' },
    );
  });

  it('puts a cover before exactly the science case pages, in order', async () => {
    const compiled = await service.compile(sampleSnapshot(), scienceCase);
    const pdf = await PDFDocument.load(compiled);
    const texts = await extractPageTexts(compiled, 20_000);
    const covers = pdf.getPageCount() - 4;
    expect(covers).toBeGreaterThanOrEqual(1);
    expect(texts.slice(covers).map((t) => t.match(/SCIENCE CASE PAGE \d/)?.[0])).toEqual([
      'SCIENCE CASE PAGE 1',
      'SCIENCE CASE PAGE 2',
      'SCIENCE CASE PAGE 3',
      'SCIENCE CASE PAGE 4',
    ]);
    expect(texts.slice(0, covers).join('\n')).not.toContain('SCIENCE CASE PAGE');
  });

  it('draws the reference, call, title, abstract, numbers and team on the cover', async () => {
    const snapshot = sampleSnapshot();
    const cover = await textOf(await service.compile(snapshot, null));
    for (const expected of [
      'SP27-0014',
      'SP27 — Semester 2027B open call',
      'Neutral hydrogen and magnetic fields along the Kestrel',
      'Standard',
      'Galaxies and the intergalactic medium',
      '2027-03-14 16:05 UTC',
      'Kestrel filament',
      'compact',
      '16.5', // total hours
      'Page 1 of',
      'No science case was attached to this version.',
      ...SAMPLE_TEAM.map((m) => m.name),
      ...SAMPLE_TEAM.map((m) => m.affiliation.split(',')[0]!),
    ]) {
      expect(cover.replace(/\s+/g, ' ')).toContain(expected);
    }
    // The calculator's numbers: the first observation's resolution and reached rms.
    const first = snapshot.observations[0]!.result;
    expect(cover).toContain(first.resolutionArcsec.toPrecision(3));
    expect(cover).toContain(first.rmsMicroJy!.toPrecision(3));
  });

  it('leaves the team out of the cover, text and metadata in an anonymous call', async () => {
    const snapshot = sampleSnapshot({ anonymous: true });
    const compiled = await service.compile(snapshot, scienceCase);
    const text = foldText(await textOf(compiled));
    // No name, no part of one (as a whole word), no affiliation.
    for (const member of SAMPLE_TEAM) {
      for (const part of [...member.name.split(/[ -]/), member.affiliation]) {
        expect(text).not.toMatch(new RegExp(`\\b${foldText(part)}\\b`));
      }
    }
    expect(text).toContain('not shown (anonymous review)');
    const pdf = await PDFDocument.load(compiled);
    expect(pdf.getAuthor()).toBeUndefined();
    expect(pdf.getTitle()).toBe(`SP27-0014: ${snapshot.title}`);
    expect(`${pdf.getSubject()} ${pdf.getKeywords()}`).not.toMatch(/Quill|Brennholt|Ngũgĩ/);
    // Nor does the science case's own metadata come along (its title names Ada Quill).
    expect(pdf.catalog.get(PDFName.of('Metadata'))).toBeUndefined();
    const uncompressed = Buffer.from(await pdf.save({ useObjectStreams: false }));
    expect(uncompressed.toString('latin1')).not.toMatch(/Quill/);
  });

  it('gives the same bytes for the same snapshot and science case', async () => {
    // Also shows that word layouts shared between documents change nothing.
    const snapshot = sampleSnapshot({ observations: 5 });
    const first = await service.compile(snapshot, scienceCase);
    const second = await service.compile(sampleSnapshot({ observations: 5 }), scienceCase);
    expect(second.equals(first)).toBe(true);
    expect((await service.compile({ ...snapshot, version: 3 }, scienceCase)).equals(first)).toBe(
      false,
    );
  });

  it('names the PI as author when the call is not anonymous', async () => {
    const pdf = await PDFDocument.load(await service.compile(sampleSnapshot(), null));
    expect(pdf.getAuthor()).toBe('Ada Quill and 3 more');
    expect(pdf.getCreator()).toBe('Skyhours');
  });

  it('runs 20 observations onto a second cover page with the table header repeated', async () => {
    const compiled = await service.compile(sampleSnapshot({ observations: 20 }), scienceCase);
    const texts = await extractPageTexts(compiled, 20_000);
    const covers = texts.length - 4;
    expect(covers).toBeGreaterThanOrEqual(2);
    expect(texts[1]).toContain('OBSERVATIONS (CONTINUED)');
    expect(texts[0]).toContain(`Page 1 of ${texts.length}`);
    expect(texts[covers - 1]).toContain(
      `The science case follows on pages ${covers + 1}–${covers + 4}.`,
    );
  });

  it('flows a maximal abstract and a large team over pages, each with its footer', async () => {
    const team = Array.from({ length: 30 }, (_, i) => ({
      ...SAMPLE_TEAM[i % SAMPLE_TEAM.length]!,
      name: `Member ${i + 1} Ngũgĩ-Łukasik`,
      affiliation: 'Department of Unusually Long Names, '.repeat(3),
      role: i === 0 ? ('pi' as const) : ('coi' as const),
    }));
    const abstract = `${SCIENCE_PROSE}\n\n`.repeat(20).slice(0, 20_000);
    const compiled = await service.compile(
      sampleSnapshot({ team, abstract, observations: 12, title: 'T'.repeat(300) }),
      scienceCase,
    );
    const texts = await extractPageTexts(compiled, 20_000);
    const covers = texts.length - 4;
    expect(covers).toBeGreaterThanOrEqual(4);
    texts.slice(0, covers).forEach((text, i) => {
      expect(text).toContain(`Page ${i + 1} of ${texts.length}`);
    });
    expect(texts.join(' ')).toContain('Member 30 Ngũgĩ-Łukasik');
  });

  it('keeps names beyond Latin-1 as they are (embedded glyphs with their Unicode)', async () => {
    const text = await textOf(await service.compile(sampleSnapshot(), null));
    expect(text).toContain('Zoë Ngũgĩ-Łukasik');
  });

  it('removes the authors of comments on the science case pages in an anonymous call', async () => {
    const source = await PDFDocument.load(scienceCase);
    const annotation = source.context.obj({
      Type: 'Annot',
      Subtype: 'Text',
      Rect: [10, 10, 30, 30],
      Contents: PDFString.of('Check this number'),
      T: PDFString.of('Ada Quill'),
    });
    source.getPage(1).node.set(PDFName.of('Annots'), source.context.obj([annotation]));
    const annotated = Buffer.from(await source.save({ useObjectStreams: false }));

    const authors = async (compiled: Buffer) => {
      const pdf = await PDFDocument.load(compiled);
      return pdf.getPages().flatMap((page) => {
        const annots = page.node.lookupMaybe(PDFName.of('Annots'), PDFArray);
        return Array.from({ length: annots?.size() ?? 0 }, (_, i) =>
          annots?.lookup(i, PDFDict).lookupMaybe(PDFName.of('T'), PDFString)?.decodeText(),
        );
      });
    };
    expect(await authors(await service.compile(sampleSnapshot(), annotated))).toEqual([
      'Ada Quill',
    ]);
    expect(
      await authors(await service.compile(sampleSnapshot({ anonymous: true }), annotated)),
    ).toEqual([undefined]);
  });
});

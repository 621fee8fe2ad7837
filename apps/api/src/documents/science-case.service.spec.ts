import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import type { Repository } from 'typeorm';
import { Clock } from '../common/clock.js';
import { AppError } from '../common/errors/app-error.js';
import type { ScienceCaseDocument } from './entities/science-case-document.entity.js';
import { REPO_ROOT } from './repo-root.js';
import { sanitiseFilename, ScienceCaseService } from './science-case.service.js';
import { SCIENCE_PROSE, samplePdf } from './testing/sample-pdf.js';

// inspect() touches no database.
const service = new ScienceCaseService({} as Repository<ScienceCaseDocument>, new Clock());
const limits = { maxBytes: 10_000_000, maxPages: 4 };
const fixture = (name: string) => readFileSync(join(REPO_ROOT, 'apps/api/test/fixtures/pdf', name));

/** The AppError inspect() throws, as the error envelope would carry it. */
async function refusal(promise: Promise<unknown>) {
  const err = await promise.then(
    () => {
      throw new Error('inspect() accepted the file');
    },
    (e: unknown) => e,
  );
  expect(err).toBeInstanceOf(AppError);
  const appError = err as AppError;
  return { status: appError.getStatus(), ...(appError.getResponse() as object) } as {
    status: number;
    code: string;
    message: string;
    issues: Array<{ path: string; message: string }>;
  };
}

describe('ScienceCaseService.inspect', () => {
  let onePage: Buffer;
  beforeAll(async () => {
    onePage = await samplePdf([SCIENCE_PROSE]);
  });

  it('accepts a real PDF and reports its pages, hash and a safe name', async () => {
    const result = await service.inspect(onePage, 'Science case.pdf', limits, null);
    expect(result).toEqual({
      pages: 1,
      sizeBytes: onePage.length,
      sha256: expect.stringMatching(/^[0-9a-f]{64}$/),
      filename: 'Science case.pdf',
      findings: [],
    });
  });

  it('judges the bytes, not the name: a PDF named .docx is accepted and named .pdf', async () => {
    const result = await service.inspect(onePage, 'case.docx', limits, null);
    expect(result.filename).toBe('case.docx.pdf');
  });

  it('accepts a PDF whose header follows a little junk, as readers do', async () => {
    const withJunk = Buffer.concat([Buffer.from('\r\n\r\n'), onePage]);
    await expect(service.inspect(withJunk, 'a.pdf', limits, null)).resolves.toMatchObject({
      pages: 1,
    });
  });

  it('refuses an empty file: 400 EMPTY_FILE', async () => {
    expect(await refusal(service.inspect(Buffer.alloc(0), 'a.pdf', limits, null))).toEqual({
      status: 400,
      statusCode: 400,
      code: 'EMPTY_FILE',
      message: 'The file is empty (0 bytes).',
      issues: [{ path: 'file', message: 'The file is empty (0 bytes).' }],
    });
  });

  it('refuses a file over the size limit with both sizes in MB: 413 FILE_TOO_LARGE', async () => {
    const big = Buffer.alloc(10_500_000);
    const r = await refusal(service.inspect(big, 'a.pdf', limits, null));
    expect(r).toMatchObject({ status: 413, code: 'FILE_TOO_LARGE' });
    expect(r.message).toBe('The file is 10.5 MB; this call accepts at most 10 MB.');
    expect(r.issues).toEqual([{ path: 'file', message: r.message }]);
  });

  it('shows as many decimals as it takes to tell a size from the limit', async () => {
    const r = await refusal(service.inspect(Buffer.alloc(10_040_000), 'a.pdf', limits, null));
    expect(r.message).toBe('The file is 10.04 MB; this call accepts at most 10 MB.');
  });

  it('refuses a text file named .pdf: 415 NOT_A_PDF', async () => {
    const text = Buffer.from('Science case\n\nThis is plain text, saved with a .pdf name.\n');
    const r = await refusal(service.inspect(text, 'science-case.pdf', limits, null));
    expect(r).toMatchObject({ status: 415, code: 'NOT_A_PDF', issues: [{ path: 'file' }] });
    expect(r.message).toMatch(/not a PDF/);
  });

  it('refuses bytes that start like a PDF but are not one: 415 NOT_A_PDF', async () => {
    for (const bytes of [
      Buffer.from('%PDF-1.7\nthis is not the rest of a PDF\n'),
      onePage.subarray(0, 200),
    ]) {
      const r = await refusal(service.inspect(bytes, 'a.pdf', limits, null));
      expect(r).toMatchObject({ status: 415, code: 'NOT_A_PDF' });
      expect(r.message).toMatch(/cannot be read/);
    }
  });

  it.each(['aes256-password.pdf', 'aes256-restrictions.pdf', 'rc4-128-restrictions.pdf'])(
    'refuses the encrypted %s: 422 PDF_ENCRYPTED',
    async (name) => {
      const r = await refusal(service.inspect(fixture(name), name, limits, null));
      expect(r).toMatchObject({ status: 422, code: 'PDF_ENCRYPTED', issues: [{ path: 'file' }] });
      expect(r.message).toMatch(/encrypted/);
    },
  );

  it('refuses more pages than the call allows, naming both counts: 422 TOO_MANY_PAGES', async () => {
    const six = await samplePdf(['1', '2', '3', '4', '5', '6']);
    const r = await refusal(service.inspect(six, 'a.pdf', limits, null));
    expect(r).toMatchObject({ status: 422, code: 'TOO_MANY_PAGES' });
    expect(r.message).toBe('The science case has 6 pages; this call allows at most 4.');
  });

  it('accepts exactly the page limit', async () => {
    const four = await samplePdf(['1', '2', '3', '4']);
    await expect(service.inspect(four, 'a.pdf', limits, null)).resolves.toMatchObject({
      pages: 4,
    });
  });

  it('refuses a PDF without pages: 422 PDF_HAS_NO_PAGES', async () => {
    // pdf-lib adds a blank page on saving unless told not to.
    const empty = Buffer.from(await (await PDFDocument.create()).save({ addDefaultPage: false }));
    const r = await refusal(service.inspect(empty, 'a.pdf', limits, null));
    expect(r).toMatchObject({ status: 422, code: 'PDF_HAS_NO_PAGES' });
  });
});

describe('ScienceCaseService.inspect in an anonymous call', () => {
  const team = { names: ['Ada Quill', 'Zoë Ngũgĩ-Łukasik', 'Tomasz Brennholt'] };

  it('gives a blocker per team name found, naming the pages it is on', async () => {
    const pdf = await samplePdf(
      [
        SCIENCE_PROSE,
        `${SCIENCE_PROSE}\nAs shown by A. Quill and collaborators, the filament is cold.`,
        `${SCIENCE_PROSE}\nReferences\nNgũgĩ-Łukasik, Z., 2026, J. Invented Astron. 12, 3`,
        `Quill, Ada, 2025, J. Invented Astron. 11, 7\n${SCIENCE_PROSE}`,
      ],
      { font: 'plex' },
    );
    const result = await service.inspect(pdf, 'a.pdf', limits, team);
    expect(result.findings).toEqual([
      {
        level: 'blocker',
        code: 'TEAM_NAME_IN_ANONYMOUS_PDF',
        field: 'documents.scienceCase',
        message:
          'Pages 2 and 4 name "Ada Quill"; in an anonymous call the science case must not name the team.',
      },
      {
        level: 'blocker',
        code: 'TEAM_NAME_IN_ANONYMOUS_PDF',
        field: 'documents.scienceCase',
        message:
          'Page 3 names "Zoë Ngũgĩ-Łukasik"; in an anonymous call the science case must not name the team.',
      },
    ]);
  });

  it('flags nothing in a science case that names no one, even citing a surname alone', async () => {
    const pdf = await samplePdf([SCIENCE_PROSE, `${SCIENCE_PROSE} Quill et al. (2024) agree.`]);
    const result = await service.inspect(pdf, 'a.pdf', limits, team);
    expect(result.findings).toEqual([]);
  });

  it('does not read the text at all outside anonymous calls', async () => {
    const pdf = await samplePdf(['Ada Quill wrote this.']);
    expect((await service.inspect(pdf, 'a.pdf', limits, null)).findings).toEqual([]);
  });

  it('warns, instead of failing, when the text has nothing to read', async () => {
    const pdf = await samplePdf([''], { figure: false });
    const result = await service.inspect(pdf, 'a.pdf', limits, team);
    expect(result.findings).toEqual([
      expect.objectContaining({ level: 'warning', code: 'SCIENCE_CASE_HAS_NO_TEXT' }),
    ]);
  });

  it('warns, instead of failing, when pdf.js cannot parse what pdf-lib could', async () => {
    // A page whose content stream is not a stream: pdf-lib counts the page, pdf.js gives up or
    // finds no text; either way the answer is a warning, never an error.
    const pdf = await PDFDocument.create();
    const page = pdf.addPage();
    page.node.set(
      (await import('pdf-lib')).PDFName.of('Contents'),
      pdf.context.obj({ Length: 999999 }),
    );
    const bytes = Buffer.from(await pdf.save());
    const result = await service.anonymityFindings(bytes, team.names);
    expect(result).toHaveLength(1);
    expect(result[0]).toMatchObject({ level: 'warning', field: 'documents.scienceCase' });
  });

  it('warns when the text cannot be extracted at all', async () => {
    const result = await service.anonymityFindings(Buffer.from('%PDF-1.4 broken'), team.names);
    expect(result).toEqual([
      expect.objectContaining({ level: 'warning', code: 'SCIENCE_CASE_TEXT_UNREADABLE' }),
    ]);
  });
});

describe('sanitiseFilename', () => {
  it.each([
    ['case.pdf', 'case.pdf'],
    ['Case.PDF', 'Case.pdf'],
    ['../../etc/passwd', 'passwd.pdf'],
    ['C:\\Users\\ada\\science case.pdf', 'science case.pdf'],
    ['evil\u202Efdp.exe', 'evilfdp.exe.pdf'],
    ['tab\tand\nnew line.pdf', 'tab and new line.pdf'],
    ['what?*:<>|".pdf', 'what_______.pdf'],
    ['...hidden.pdf', 'hidden.pdf'],
    ['case.pdf  ', 'case.pdf'],
    ['', 'science-case.pdf'],
    ['.pdf', 'science-case.pdf'],
    ['con.pdf', '_con.pdf'],
    ['Zoë Ngũgĩ-Łukasik.pdf', 'Zoë Ngũgĩ-Łukasik.pdf'],
  ])('%j → %j', (input, expected) => {
    expect(sanitiseFilename(input)).toBe(expected);
  });

  it('keeps at most 120 characters before the .pdf', () => {
    const name = sanitiseFilename(`${'ł'.repeat(300)}.pdf`);
    expect(name).toBe(`${'ł'.repeat(120)}.pdf`);
  });
});

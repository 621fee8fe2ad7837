import { createHash } from 'node:crypto';
import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { PDFDocument } from 'pdf-lib';
import { type EntityManager, IsNull, type Repository } from 'typeorm';
import { Clock } from '../common/clock.js';
import { AppError, notFound } from '../common/errors/app-error.js';
import type { DocumentFinding } from './document-finding.js';
import { ScienceCaseDocument } from './entities/science-case-document.entity.js';
import { extractPageTexts } from './pdf-text.js';
import { nameMatchers, namesIn } from './team-names.js';

/** A call's size limit is set in MB; one MB is 10^6 bytes here, as file managers show sizes. */
export const BYTES_PER_MB = 1_000_000;

export interface ScienceCaseLimits {
  maxBytes: number;
  maxPages: number;
}

/** In an anonymous call: the names of everyone on the team (PI and Co-Is). */
export interface AnonymityCheck {
  names: string[];
}

export interface InspectedScienceCase {
  pages: number;
  sizeBytes: number;
  /** Lower-case hex SHA-256 of the bytes. */
  sha256: string;
  /** The sanitised name to store and to offer on download. */
  filename: string;
  /** Blockers stop the submission, warnings do not; an upload is stored either way. */
  findings: DocumentFinding[];
}

export interface StoreScienceCase {
  proposalId: string;
  bytes: Buffer;
  /** What inspect() answered for these very bytes. */
  inspected: InspectedScienceCase;
  uploadedBy: string;
}

/** pdf.js gets this long to read a file's text; the page and size limits keep honest files far below. */
const TEXT_TIMEOUT_MS = 20_000;
/** The first key of the advisory lock that serialises uploads to one proposal. */
const UPLOAD_LOCK = 0x5c1e;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const FIELD = 'documents.scienceCase' as const;

/** The science-case PDF: its checks on upload, and its storage with the proposal. */
@Injectable()
export class ScienceCaseService {
  constructor(
    @InjectRepository(ScienceCaseDocument)
    private readonly documents: Repository<ScienceCaseDocument>,
    private readonly clock: Clock,
  ) {}

  /**
   * Judges an upload by its bytes alone (not its name nor its declared type). Throws an AppError
   * (`issues: [{ path: 'file' }]`) for a file that cannot be a science case: EMPTY_FILE 400,
   * FILE_TOO_LARGE 413, NOT_A_PDF 415, PDF_ENCRYPTED 422, PDF_HAS_NO_PAGES 422,
   * TOO_MANY_PAGES 422. In an anonymous call, `anonymity` lists the team's names and each one
   * found in the text is a blocker finding naming its pages.
   */
  async inspect(
    bytes: Buffer,
    originalName: string,
    limits: ScienceCaseLimits,
    anonymity: AnonymityCheck | null,
  ): Promise<InspectedScienceCase> {
    if (bytes.length === 0) {
      throw refuse(HttpStatus.BAD_REQUEST, 'EMPTY_FILE', 'The file is empty (0 bytes).');
    }
    if (bytes.length > limits.maxBytes) {
      const [size, limit] = megabytes(bytes.length, limits.maxBytes);
      throw refuse(
        HttpStatus.PAYLOAD_TOO_LARGE,
        'FILE_TOO_LARGE',
        `The file is ${size} MB; this call accepts at most ${limit} MB.`,
      );
    }
    const pages = await countPages(bytes);
    if (pages > limits.maxPages) {
      throw refuse(
        HttpStatus.UNPROCESSABLE_ENTITY,
        'TOO_MANY_PAGES',
        `The science case has ${pages} pages; this call allows at most ${limits.maxPages}.`,
      );
    }
    return {
      pages,
      sizeBytes: bytes.length,
      sha256: sha256(bytes),
      filename: sanitiseFilename(originalName),
      findings: anonymity ? await this.anonymityFindings(bytes, anonymity.names) : [],
    };
  }

  /**
   * The anonymity findings alone, for a PDF already accepted by inspect(): submission runs this
   * again with the team as it is then, since Co-Is may have joined after the upload. Never
   * throws for the file's sake: a text that cannot be read is a warning.
   */
  async anonymityFindings(bytes: Uint8Array, names: string[]): Promise<DocumentFinding[]> {
    let pageTexts: string[];
    try {
      pageTexts = await extractPageTexts(bytes, TEXT_TIMEOUT_MS);
    } catch {
      return [
        {
          level: 'warning',
          code: 'SCIENCE_CASE_TEXT_UNREADABLE',
          field: FIELD,
          message:
            'The text of the science case could not be read, so it was not checked for the ' +
            "team's names; make sure it names no one.",
        },
      ];
    }
    if (pageTexts.every((text) => text.trim() === '')) {
      return [
        {
          level: 'warning',
          code: 'SCIENCE_CASE_HAS_NO_TEXT',
          field: FIELD,
          message:
            'The science case has no text that can be read (pages of images only?), so it was ' +
            "not checked for the team's names; make sure it names no one.",
        },
      ];
    }
    const matchers = nameMatchers(names);
    const pagesByName = new Map<string, number[]>();
    pageTexts.forEach((text, i) => {
      for (const name of namesIn(text, matchers)) {
        pagesByName.set(name, [...(pagesByName.get(name) ?? []), i + 1]);
      }
    });
    return [...pagesByName].map(([name, pages]) => ({
      level: 'blocker',
      code: 'TEAM_NAME_IN_ANONYMOUS_PDF',
      field: FIELD,
      message:
        `${pages.length === 1 ? 'Page' : 'Pages'} ${listOf(pages)} ` +
        `${pages.length === 1 ? 'names' : 'name'} "${name}"; in an anonymous call the ` +
        'science case must not name the team.',
    }));
  }

  /**
   * Stores an inspected upload as the proposal's current science case and marks the previous one
   * superseded, in `manager`'s transaction (the caller's, e.g. a submission's) or in a new one.
   */
  async store(manager: EntityManager, input: StoreScienceCase): Promise<ScienceCaseDocument> {
    const { proposalId, bytes, inspected, uploadedBy } = input;
    if (sha256(bytes) !== inspected.sha256) {
      throw new Error('store() was given bytes other than the ones inspect() judged');
    }
    const run = async (m: EntityManager) => {
      // Two uploads at once to one proposal would both find the same current row; the second
      // waits here until the first commits, and then supersedes it.
      await m.query('SELECT pg_advisory_xact_lock($1, hashtext($2))', [UPLOAD_LOCK, proposalId]);
      const now = this.clock.now();
      await m.update(
        ScienceCaseDocument,
        { proposalId, supersededAt: IsNull() },
        { supersededAt: now },
      );
      return m.save(
        m.create(ScienceCaseDocument, {
          proposalId,
          filename: inspected.filename,
          contentType: 'application/pdf',
          sizeBytes: bytes.length,
          pages: inspected.pages,
          sha256: inspected.sha256,
          content: bytes,
          uploadedBy,
          uploadedAt: now,
          supersededAt: null,
        }),
      );
    };
    return manager.queryRunner?.isTransactionActive ? run(manager) : manager.transaction(run);
  }

  /** The proposal's current science case (without its bytes), or null when none was uploaded. */
  current(
    proposalId: string,
    manager = this.documents.manager,
  ): Promise<ScienceCaseDocument | null> {
    if (!UUID.test(proposalId)) return Promise.resolve(null);
    return manager.findOne(ScienceCaseDocument, { where: { proposalId, supersededAt: IsNull() } });
  }

  /** The bytes of one stored document, current or superseded; NOT_FOUND 404 when there is none. */
  async content(documentId: string, manager = this.documents.manager): Promise<Buffer> {
    const row = UUID.test(documentId)
      ? await manager
          .createQueryBuilder(ScienceCaseDocument, 'd')
          .addSelect('d.content')
          .where('d.id = :documentId', { documentId })
          .getOne()
      : null;
    if (!row?.content) throw notFound('Document');
    return row.content;
  }
}

/**
 * The page count, judging the bytes: a PDF header where the format puts it, then a document
 * pdf-lib can load and walk. An encrypted PDF is refused whether or not it needs a password to
 * open: its pages could not be copied into the compiled PDF. pdf-lib tells encryption by
 * `isEncrypted` when told to ignore it (its EncryptedPDFError, compiled to ES5, is a plain Error
 * to `instanceof`).
 */
async function countPages(bytes: Buffer): Promise<number> {
  // The header may follow a little junk: readers look for it in the first 1024 bytes.
  if (bytes.subarray(0, 1024).indexOf('%PDF-') < 0) {
    throw refuse(
      HttpStatus.UNSUPPORTED_MEDIA_TYPE,
      'NOT_A_PDF',
      'The file is not a PDF: it does not start with a PDF header.',
    );
  }
  const encrypted = () =>
    refuse(
      HttpStatus.UNPROCESSABLE_ENTITY,
      'PDF_ENCRYPTED',
      'The PDF is encrypted or password-protected; upload a copy saved without protection.',
    );
  const unreadable = () =>
    refuse(
      HttpStatus.UNSUPPORTED_MEDIA_TYPE,
      'NOT_A_PDF',
      'The file starts like a PDF but cannot be read as one (damaged or incomplete?).',
    );
  let pdf: PDFDocument;
  try {
    pdf = await PDFDocument.load(bytes, { ignoreEncryption: true, updateMetadata: false });
  } catch {
    // Encrypted objects can trip the parser before it reaches the trailer's /Encrypt.
    throw bytes.indexOf('/Encrypt') >= 0 ? encrypted() : unreadable();
  }
  if (pdf.isEncrypted) throw encrypted();
  let pages: number;
  try {
    pages = pdf.getPageCount();
  } catch {
    throw unreadable();
  }
  if (pages === 0) {
    throw refuse(HttpStatus.UNPROCESSABLE_ENTITY, 'PDF_HAS_NO_PAGES', 'The PDF has no pages.');
  }
  return pages;
}

const refuse = (status: HttpStatus, code: string, message: string) =>
  new AppError(status, code, message, [{ path: 'file', message }]);

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** Both sizes in MB, with as many decimals as it takes to tell them apart (at most 6). */
function megabytes(bytes: number, limitBytes: number): [string, string] {
  const show = (n: number, decimals: number) =>
    (n / BYTES_PER_MB).toFixed(decimals).replace(/\.?0+$/, '');
  let decimals = 1;
  while (decimals < 6 && show(bytes, decimals) === show(limitBytes, decimals)) decimals++;
  return [show(bytes, decimals), show(limitBytes, decimals)];
}

/** "2", "2 and 5", "2, 3 and 5". */
function listOf(numbers: number[]): string {
  const last = numbers[numbers.length - 1];
  return numbers.length < 2 ? String(last) : `${numbers.slice(0, -1).join(', ')} and ${last}`;
}

const WINDOWS_RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9])$/i;
const MAX_STEM_LENGTH = 120;

/**
 * A safe name to store and offer on download: no folders, no control or format characters (such
 * as a right-to-left override that disguises an extension), none of \/:*?"<>|, no leading dots,
 * at most 120 characters before a `.pdf` ending, which it always has (the bytes are a PDF).
 */
export function sanitiseFilename(name: string): string {
  const base = name.split(/[/\\]/).pop() ?? '';
  let stem = base
    .normalize('NFC')
    .replace(/\s+/g, ' ')
    .replace(/[\p{Cc}\p{Cf}\p{Cs}\p{Co}\p{Cn}]/gu, '')
    .replace(/[:*?"<>|]/g, '_')
    .trim()
    .replace(/\.pdf$/i, '')
    .replace(/^[\s.]+|[\s.]+$/g, '');
  stem = [...stem].slice(0, MAX_STEM_LENGTH).join('').trim();
  if (WINDOWS_RESERVED.test(stem)) stem = `_${stem}`;
  return `${stem || 'science-case'}.pdf`;
}

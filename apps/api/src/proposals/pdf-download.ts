import { StreamableFile } from '@nestjs/common';
import type { Response } from 'express';
import { contentDisposition } from '../documents/content-disposition.js';

/** A PDF answer that a browser downloads and never sniffs into something else. */
export function pdfDownload(
  res: Response,
  file: { filename: string; bytes: Buffer },
): StreamableFile {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', contentDisposition(file.filename));
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', 'private, no-store');
  return new StreamableFile(file.bytes, { type: 'application/pdf', length: file.bytes.length });
}

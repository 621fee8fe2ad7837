import {
  type CallHandler,
  type ExecutionContext,
  HttpStatus,
  Injectable,
  type NestInterceptor,
} from '@nestjs/common';
import type { Request, Response } from 'express';
import multer from 'multer';
import type { Observable } from 'rxjs';
import type { SessionUser } from '../auth/session-user.js';
import { AppError } from '../common/errors/app-error.js';
import { ScienceCaseUploads } from './science-case-uploads.service.js';

/**
 * Reads a science-case upload (multipart, field `file`) into memory with multer, limited to the
 * proposal's call's size limit: the rights are checked first (a stranger's upload is never read)
 * and an oversized file is cut off as it streams in with a 413, not after it has all arrived.
 */
@Injectable()
export class ScienceCaseUploadInterceptor implements NestInterceptor {
  constructor(private readonly uploads: ScienceCaseUploads) {}

  async intercept(context: ExecutionContext, next: CallHandler): Promise<Observable<unknown>> {
    const http = context.switchToHttp();
    const req = http.getRequest<Request>();
    const res = http.getResponse<Response>();
    const reference = String(req.params.reference ?? '');
    const limit = await this.uploads.uploadLimit(req.user as SessionUser, reference);
    const read = multer({
      storage: multer.memoryStorage(),
      // Browsers send the file's name as raw UTF-8 (the HTML form encoding), not Latin-1.
      defParamCharset: 'utf8',
      limits: { fileSize: limit.bytes, files: 1, fields: 5, fieldSize: 1000, parts: 6 },
    }).single('file');
    await new Promise<void>((resolve, reject) =>
      read(req, res, (error: unknown) => (error ? reject(refusal(error, limit.mb)) : resolve())),
    );
    return next.handle();
  }
}

function refusal(error: unknown, limitMb: number): unknown {
  if (error instanceof AppError) return error;
  if (!(error instanceof multer.MulterError)) {
    // busboy's own errors (a malformed part header, e.g. a NUL in the file name; a body that
    // ends early) are plain Errors: the client sent a body that is not multipart, not a fault
    // of ours.
    const message = 'The upload could not be read as multipart form data.';
    return new AppError(HttpStatus.BAD_REQUEST, 'BAD_UPLOAD', message, [{ path: 'file', message }]);
  }
  const field = error.field ?? 'file';
  switch (error.code) {
    case 'LIMIT_FILE_SIZE': {
      const message = `The file is larger than this call's limit of ${limitMb} MB.`;
      return new AppError(HttpStatus.PAYLOAD_TOO_LARGE, 'FILE_TOO_LARGE', message, [
        { path: 'file', message },
      ]);
    }
    case 'LIMIT_UNEXPECTED_FILE':
    case 'LIMIT_FILE_COUNT': {
      const message = `Send one file, in the form field "file" (got one in "${field}").`;
      return new AppError(HttpStatus.BAD_REQUEST, 'UNEXPECTED_FILE', message, [
        { path: field, message },
      ]);
    }
    default:
      return new AppError(
        HttpStatus.BAD_REQUEST,
        'BAD_UPLOAD',
        `The upload was refused: ${error.message}`,
        [{ path: field, message: error.message }],
      );
  }
}

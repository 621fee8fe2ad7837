import { HttpException, HttpStatus } from '@nestjs/common';

/** One problem with one field of the request, `path` in dotted form (`target.decDeg`). */
export interface FieldIssue {
  path: string;
  message: string;
}

/** The one error envelope every failing request answers with. */
export interface ErrorEnvelope {
  statusCode: number;
  code: string;
  message: string;
  issues?: FieldIssue[];
}

/** An expected failure with a stable machine-readable code. */
export class AppError extends HttpException {
  constructor(
    status: HttpStatus,
    readonly code: string,
    message: string,
    readonly issues?: FieldIssue[],
  ) {
    super({ statusCode: status, code, message, ...(issues ? { issues } : {}) }, status);
  }
}

export const validationFailed = (issues: FieldIssue[], message?: string) =>
  new AppError(
    HttpStatus.BAD_REQUEST,
    'VALIDATION_FAILED',
    message ?? `Invalid ${issues.map((i) => i.path).join(', ')}`,
    issues,
  );

/** Used both for what does not exist and for what the user may not see, so nothing leaks. */
export const notFound = (what: string) =>
  new AppError(HttpStatus.NOT_FOUND, 'NOT_FOUND', `${what} not found`);

export const conflict = (code: string, message: string) =>
  new AppError(HttpStatus.CONFLICT, code, message);

export const forbidden = (message = 'You do not have the rights for this') =>
  new AppError(HttpStatus.FORBIDDEN, 'FORBIDDEN', message);

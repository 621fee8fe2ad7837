import { ValidationPipe, type ValidationError } from '@nestjs/common';
import { type FieldIssue, validationFailed } from './errors/app-error.js';

/** Flattens class-validator's tree into dotted paths (`target.decDeg`, `observations.0.hours`). */
export function flattenValidationErrors(errors: ValidationError[], prefix = ''): FieldIssue[] {
  return errors.flatMap((error) => {
    const path = prefix ? `${prefix}.${error.property}` : error.property;
    const own = Object.values(error.constraints ?? {}).map((message) => ({ path, message }));
    return [...own, ...flattenValidationErrors(error.children ?? [], path)];
  });
}

export function createValidationPipe(): ValidationPipe {
  return new ValidationPipe({
    whitelist: true,
    forbidNonWhitelisted: true,
    transform: true,
    validationError: { target: false, value: false },
    exceptionFactory: (errors) => validationFailed(flattenValidationErrors(errors)),
  });
}

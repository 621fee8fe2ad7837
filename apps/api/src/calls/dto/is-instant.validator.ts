import { registerDecorator, type ValidationOptions } from 'class-validator';
import { DateTime } from 'luxon';

/**
 * An instant in ISO 8601 with its offset (2027-01-15T17:00:00-08:00 or …Z). A date-time without an
 * offset is refused: the server cannot know which zone it was meant in.
 */
const WITH_OFFSET = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:?\d{2})$/;

export const isInstant = (value: unknown): value is string =>
  typeof value === 'string' && WITH_OFFSET.test(value) && DateTime.fromISO(value).isValid;

export function IsInstant(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyKey) =>
    registerDecorator({
      name: 'isInstant',
      target: target.constructor,
      propertyName: propertyKey as string,
      options: {
        message: ({ property }) =>
          `${property} must be an ISO 8601 date-time with an offset, e.g. 2027-01-15T17:00:00-08:00`,
        ...options,
      },
      validator: { validate: isInstant },
    });
}

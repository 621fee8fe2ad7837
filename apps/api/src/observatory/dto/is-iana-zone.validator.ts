import { Transform } from 'class-transformer';
import { registerDecorator, type ValidationOptions } from 'class-validator';
import { IANAZone } from 'luxon';

/** A zone name such as Europe/Oslo; offsets like +02:00 are refused (they ignore summer time). */
const ZONE_SHAPE = /^[A-Za-z][A-Za-z_]*(\/[A-Za-z0-9_+-]+)*$/;

export const isIanaZone = (value: unknown): value is string =>
  typeof value === 'string' && ZONE_SHAPE.test(value) && IANAZone.isValidZone(value);

/** The zone's canonical spelling (america/los_angeles → America/Los_Angeles). */
export const canonicalZone = (value: string): string =>
  new Intl.DateTimeFormat('en', { timeZone: value }).resolvedOptions().timeZone;

/** Validates an IANA time-zone name and stores its canonical spelling. */
export function IsIanaZone(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyKey) => {
    Transform(({ value }) => (isIanaZone(value) ? canonicalZone(value) : value))(
      target,
      propertyKey,
    );
    registerDecorator({
      name: 'isIanaZone',
      target: target.constructor,
      propertyName: propertyKey as string,
      options: {
        message: ({ property }) =>
          `${property} must be an IANA time-zone name such as America/Los_Angeles`,
        ...options,
      },
      validator: { validate: isIanaZone },
    });
  };
}

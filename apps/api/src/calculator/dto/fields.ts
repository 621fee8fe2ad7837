import { applyDecorators } from '@nestjs/common';
import { Transform, Type } from 'class-transformer';
import {
  IsInt,
  IsNumber,
  IsOptional,
  ValidateBy,
  ValidateNested,
  type ValidationArguments,
} from 'class-validator';

/**
 * The DTOs check the shape and the types of the body; the ranges and the rules between fields
 * (shortest ≤ longest baseline, frequency or line) belong to @skyhours/calc, so that the browser's
 * live preview and the server refuse exactly the same values.
 */

/** Stands in for an array where an object belongs, so that it is reported once (see NestedObject). */
const AN_ARRAY = Symbol('an array');

function describeValue(value: unknown): string {
  if (value === AN_ARRAY || Array.isArray(value)) return 'an array';
  if (typeof value === 'string')
    return JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}…` : value);
  if (typeof value === 'object') return 'an object';
  return String(value);
}

const typeMessage =
  (kind: string) =>
  ({ value }: ValidationArguments): string =>
    value === undefined || value === null
      ? `Required: ${kind}.`
      : `Must be ${kind}, got ${describeValue(value)}.`;

/** A required JSON number (never a numeric string: there is no implicit conversion). */
export const NumberField = () =>
  IsNumber({ allowNaN: false, allowInfinity: false }, { message: typeMessage('a number') });

export const IntegerField = () => IsInt({ message: typeMessage('a whole number') });

/** A number that may be absent or null (null and absent mean the same, as in the library). */
export const OptionalNumberField = () => applyDecorators(IsOptional(), NumberField());

/**
 * A nested object, validated field by field. ValidateNested alone would skip an absent value and
 * validate an array element by element (reporting `array.0.antennas` for `"array": [{}]`), so an
 * array becomes a marker that it reports as a wrong type, and absence is checked apart: every
 * wrong shape gives exactly one issue at the object's own path.
 */
export const NestedObject = (type: () => new () => object) =>
  applyDecorators(
    Type(type),
    Transform(({ value }: { value: unknown }) => (Array.isArray(value) ? AN_ARRAY : value), {
      toClassOnly: true,
    }),
    ValidateNested({ message: typeMessage('an object') }),
    ValidateBy({
      name: 'isPresent',
      validator: {
        validate: (value: unknown) => value !== undefined,
        defaultMessage: () => 'Required: an object.',
      },
    }),
  );

import { registerDecorator, type ValidationOptions } from 'class-validator';
import { isValidOrcid } from './orcid.js';

/** class-validator rule: an ORCID iD in its bare form with a right check character. */
export function IsOrcid(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyName) =>
    registerDecorator({
      name: 'isOrcid',
      target: target.constructor,
      propertyName: String(propertyName),
      options: {
        message: `${String(propertyName)} must be an ORCID iD like 0000-0002-1825-0097 with a right check digit`,
        ...options,
      },
      validator: { validate: (value: unknown) => typeof value === 'string' && isValidOrcid(value) },
    });
}

import { dictionary } from '@zxcvbn-ts/language-common';
import { registerDecorator, type ValidationOptions } from 'class-validator';

export const PASSWORD_MIN_LENGTH = 12;
/** Long enough for any passphrase, short enough that hashing it costs nothing extra. */
export const PASSWORD_MAX_LENGTH = 256;

/**
 * The common-password list of zxcvbn-ts (its `passwords-common` dictionary, about 49 000 entries,
 * all lower case). Loaded once, on first use.
 */
let common: Set<string> | undefined;
const commonPasswords = (): Set<string> => (common ??= new Set(dictionary['passwords-common']));

/** Why a password is refused, or null when it is acceptable. Lengths count characters, not bytes. */
export function passwordProblem(password: string): string | null {
  const length = [...password].length;
  if (length < PASSWORD_MIN_LENGTH)
    return `Use at least ${PASSWORD_MIN_LENGTH} characters (a few words make a good one)`;
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters`;
  if (commonPasswords().has(password.toLowerCase()))
    return 'This password is on a list of common passwords; choose another';
  if (new Set(password).size < 4) return 'This password repeats too few characters; choose another';
  return null;
}

/** class-validator rule: the property is a string the password policy accepts. */
export function IsAcceptablePassword(options?: ValidationOptions): PropertyDecorator {
  return (target, propertyName) =>
    registerDecorator({
      name: 'isAcceptablePassword',
      target: target.constructor,
      propertyName: String(propertyName),
      options,
      validator: {
        validate: (value: unknown) => typeof value === 'string' && passwordProblem(value) === null,
        defaultMessage: (args) =>
          typeof args?.value === 'string'
            ? (passwordProblem(args.value) ?? 'Choose another password')
            : 'The password must be text',
      },
    });
}

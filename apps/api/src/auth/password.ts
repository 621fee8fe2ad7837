import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * Passwords are hashed with scrypt, a memory-hard function built into Node. Parameters
 * N=2^15, r=8, p=3 (about 32 MiB per hash) are one of the equivalent settings the OWASP Password
 * Storage Cheat Sheet lists for scrypt (from memory). They are stored in each hash, so they can be
 * raised later without breaking old hashes.
 */
const PARAMS = { N: 2 ** 15, r: 8, p: 3 } as const;
const KEY_LENGTH = 32;

function derive(
  password: string,
  salt: Buffer,
  options: ScryptOptions,
  keyLength: number,
): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(
      password.normalize('NFKC'),
      salt,
      keyLength,
      { ...options, maxmem: 256 * 1024 * 1024 },
      (err, key) => (err ? reject(err) : resolve(key)),
    ),
  );
}

export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive(password, salt, PARAMS, KEY_LENGTH);
  return [
    'scrypt',
    PARAMS.N,
    PARAMS.r,
    PARAMS.p,
    salt.toString('base64'),
    key.toString('base64'),
  ].join('$');
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, salt, key] = stored.split('$');
  if (scheme !== 'scrypt' || !n || !r || !p || !salt || !key) return false;
  const expected = Buffer.from(key, 'base64');
  const actual = await derive(
    password,
    Buffer.from(salt, 'base64'),
    { N: Number(n), r: Number(r), p: Number(p) },
    expected.length,
  );
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}

/**
 * A hash of a random password, checked against when the e-mail is unknown so that an unknown
 * account costs the same time as a wrong password.
 */
let decoy: Promise<string> | undefined;
export const decoyHash = (): Promise<string> =>
  (decoy ??= hashPassword(randomBytes(24).toString('base64')));

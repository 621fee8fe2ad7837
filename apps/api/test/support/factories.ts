import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import { hashPassword } from '../../src/auth/password.js';
import { User } from '../../src/users/entities/user.entity.js';

export const TEST_PASSWORD = 'correct horse battery staple 42';
let passwordHash: Promise<string> | undefined;

/** A unique e-mail address so tests never depend on each other's rows. */
export const uniqueEmail = (label = 'user') => `${label}-${randomUUID().slice(0, 8)}@example.org`;

export async function makeUser(
  dataSource: DataSource,
  overrides: Partial<User> = {},
): Promise<User> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const repo = dataSource.getRepository(User);
  return repo.save(
    repo.create({
      email: uniqueEmail(),
      name: 'Test Person',
      affiliation: 'Example Institute of Testing',
      country: 'NZ',
      orcid: null,
      passwordHash: await passwordHash,
      emailVerifiedAt: new Date(),
      roles: [],
      ...overrides,
    }),
  );
}

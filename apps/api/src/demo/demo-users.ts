import type { EntityManager } from 'typeorm';
import { hashPassword } from '../auth/password.js';
import { type GlobalRole, User } from '../users/entities/user.entity.js';
import type { DemoContext } from './demo-context.js';

/** One sign-in per role, named after it; all invented. */
const ROLE_ACCOUNTS: {
  email: string;
  name: string;
  affiliation: string;
  country: string;
  roles: GlobalRole[];
}[] = [
  {
    email: 'proposer@skyhours.test',
    name: 'Priya Okonkwo-Lind',
    affiliation: 'Harrowgate Institute for Radio Studies',
    country: 'GB',
    roles: [],
  },
  {
    email: 'referee@skyhours.test',
    name: 'Tomasz Reyes-Halvorsen',
    affiliation: 'Sundial Point Observatory College',
    country: 'NO',
    roles: [],
  },
  {
    email: 'chair@skyhours.test',
    name: 'Ilse Marchetti-Obi',
    affiliation: 'Calder Basin University',
    country: 'DE',
    roles: [],
  },
  {
    email: 'staff@skyhours.test',
    name: 'Wen Adeyemi-Brandt',
    affiliation: 'Larkspur Valley Array',
    country: 'US',
    roles: ['staff'],
  },
  {
    email: 'admin@skyhours.test',
    name: 'Noor Castellanos-Weil',
    affiliation: 'Larkspur Valley Array',
    country: 'US',
    roles: ['admin'],
  },
];

export async function loadDemoUsers(manager: EntityManager, context: DemoContext): Promise<void> {
  const passwordHash = await hashPassword(context.password);
  const rows = ROLE_ACCOUNTS.map((account) =>
    manager.create(User, { ...account, passwordHash, emailVerifiedAt: context.now, orcid: null }),
  );
  const saved = await manager.save(User, rows);
  for (const user of saved) context.users.set(user.email, user);
}

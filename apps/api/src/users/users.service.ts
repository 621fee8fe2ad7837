import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { Repository } from 'typeorm';
import type { SessionUser } from '../auth/session-user.js';
import { type Role, User } from './entities/user.entity.js';

@Injectable()
export class UsersService {
  constructor(@InjectRepository(User) private readonly users: Repository<User>) {}

  findByEmailWithHash(email: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email: email.trim().toLowerCase() })
      .getOne();
  }

  /** Loads the user as a request sees it, or null when the account is gone or deactivated. */
  async loadSessionUser(id: string): Promise<SessionUser | null> {
    const user = await this.users.findOne({ where: { id } });
    if (!user || !user.active) return null;
    return this.toSessionUser(user);
  }

  toSessionUser(user: User): SessionUser {
    const emailVerified = user.emailVerifiedAt !== null;
    const callRoles: SessionUser['callRoles'] = [];
    const roles = new Set<Role>(user.roles);
    if (emailVerified) roles.add('proposer');
    for (const grant of callRoles) roles.add(grant.role);
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      affiliation: user.affiliation,
      country: user.country,
      emailVerified,
      globalRoles: user.roles,
      callRoles,
      roles: [...roles],
      sessionEpoch: user.sessionEpoch,
    };
  }
}

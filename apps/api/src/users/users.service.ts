import { HttpStatus, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import type { DataSource, Repository } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { RequestOrigin } from '../audit/request-origin.js';
import type { SessionUser } from '../auth/session-user.js';
import { AppError, notFound } from '../common/errors/app-error.js';
import type { ListUsersQuery, UserSort } from './dto/list-users.query.js';
import { likePattern } from './dto/page-query.dto.js';
import type { UpdateProfileDto } from './dto/update-profile.dto.js';
import type { UpdateUserDto } from './dto/update-user.dto.js';
import { type Role, User } from './entities/user.entity.js';

const SORT_COLUMNS: Record<UserSort, string> = {
  name: 'u.name',
  email: 'u.email',
  affiliation: 'u.affiliation',
  country: 'u.country',
  createdAt: 'u.createdAt',
  lastSignInAt: 'u.lastSignInAt',
};

const sameSet = (a: readonly string[], b: readonly string[]) =>
  a.length === b.length && a.every((x) => b.includes(x));

@Injectable()
export class UsersService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  findByEmailWithHash(email: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.email = :email', { email: email.trim().toLowerCase() })
      .getOne();
  }

  findByIdWithHash(id: string): Promise<User | null> {
    return this.users
      .createQueryBuilder('u')
      .addSelect('u.passwordHash')
      .where('u.id = :id', { id })
      .getOne();
  }

  /** Loads the user as a request sees it, or null when the account is gone or deactivated. */
  async loadSessionUser(id: string): Promise<SessionUser | null> {
    const user = await this.users.findOne({ where: { id } });
    if (!user || !user.active) return null;
    return this.toSessionUser(user);
  }

  /** The user as a request sees it, with the per-call roles (chair, referee) they hold. */
  async toSessionUser(user: User): Promise<SessionUser> {
    const emailVerified = user.emailVerifiedAt !== null;
    const callRoles: SessionUser['callRoles'] = await this.users.manager.query(
      `SELECT c.code AS "callCode", r.role FROM call_roles r JOIN calls c ON c.id = r.call_id
        WHERE r.user_id = $1 ORDER BY c.code, r.role`,
      [user.id],
    );
    const roles = new Set<Role>(user.roles);
    if (emailVerified) roles.add('proposer');
    // A per-call role counts only once the address is proven, like the proposer role.
    if (emailVerified) for (const grant of callRoles) roles.add(grant.role);
    return {
      id: user.id,
      email: user.email,
      name: user.name,
      affiliation: user.affiliation,
      country: user.country,
      orcid: user.orcid,
      emailVerified,
      globalRoles: user.roles,
      callRoles,
      roles: [...roles],
      sessionEpoch: user.sessionEpoch,
    };
  }

  /** The Accounts screen's list: search, filters, sort and page all done in the database. */
  async list(query: ListUsersQuery): Promise<{ items: User[]; total: number }> {
    const qb = this.users.createQueryBuilder('u');
    if (query.q) {
      qb.andWhere(
        `(u.name ILIKE :q ESCAPE '\\' OR u.email ILIKE :q ESCAPE '\\' OR u.affiliation ILIKE :q ESCAPE '\\')`,
        { q: likePattern(query.q) },
      );
    }
    if (query.role) qb.andWhere(':role = ANY(u.roles)', { role: query.role });
    if (query.status === 'active') qb.andWhere('u.active AND u.emailVerifiedAt IS NOT NULL');
    if (query.status === 'unverified') qb.andWhere('u.active AND u.emailVerifiedAt IS NULL');
    if (query.status === 'deactivated') qb.andWhere('NOT u.active');
    const order = query.order === 'desc' ? 'DESC' : 'ASC';
    qb.orderBy(SORT_COLUMNS[query.sort], order, order === 'ASC' ? 'NULLS LAST' : 'NULLS FIRST')
      .addOrderBy('u.id', 'ASC')
      .skip((query.page - 1) * query.pageSize)
      .take(query.pageSize);
    const [items, total] = await qb.getManyAndCount();
    return { items, total };
  }

  async get(id: string): Promise<User> {
    const user = await this.users.findOne({ where: { id } });
    if (!user) throw notFound('Account');
    return user;
  }

  /**
   * An admin's change to roles and active state. Deactivating bumps the session epoch, so every
   * session of the account ends on its next request. An admin cannot take away their own admin
   * role or deactivate themselves, so at least one admin always remains.
   */
  async adminUpdate(
    id: string,
    change: UpdateUserDto,
    actor: SessionUser,
    origin: RequestOrigin,
  ): Promise<User> {
    return this.dataSource.transaction(async (manager) => {
      const user = await manager.findOne(User, {
        where: { id },
        lock: { mode: 'pessimistic_write' },
      });
      if (!user) throw notFound('Account');
      if (user.id === actor.id && change.roles && !change.roles.includes('admin')) {
        throw selfLockout('roles', 'You cannot take away your own admin role');
      }
      if (user.id === actor.id && change.active === false) {
        throw selfLockout('active', 'You cannot deactivate your own account');
      }
      const audit = { actorId: origin.actorId, ip: origin.ip, subjectType: 'user', subjectId: id };
      if (change.roles && !sameSet(change.roles, user.roles)) {
        await this.audit.record(
          {
            ...audit,
            action: 'user.roles-changed',
            details: { from: user.roles, to: change.roles },
          },
          manager,
        );
        user.roles = [...change.roles].sort();
      }
      if (change.active !== undefined && change.active !== user.active) {
        user.active = change.active;
        if (!change.active) user.sessionEpoch += 1;
        await this.audit.record(
          { ...audit, action: change.active ? 'user.reactivated' : 'user.deactivated' },
          manager,
        );
      }
      return manager.save(user);
    });
  }

  /** The user's own change to their details. */
  async updateProfile(id: string, change: UpdateProfileDto, origin: RequestOrigin): Promise<void> {
    const fields = Object.fromEntries(
      Object.entries(change).filter(([, value]) => value !== undefined),
    ) as Partial<Pick<User, 'name' | 'affiliation' | 'country' | 'orcid'>>;
    if (Object.keys(fields).length === 0) return;
    await this.dataSource.transaction(async (manager) => {
      await manager.update(User, { id }, fields);
      await this.audit.record(
        {
          ...origin,
          action: 'user.profile-updated',
          subjectType: 'user',
          subjectId: id,
          details: { fields: Object.keys(fields) },
        },
        manager,
      );
    });
  }
}

const selfLockout = (path: string, message: string) =>
  new AppError(HttpStatus.CONFLICT, 'SELF_LOCKOUT', message, [{ path, message }]);

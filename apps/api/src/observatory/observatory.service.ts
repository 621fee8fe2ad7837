import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { isUUID } from 'class-validator';
import { type DataSource, type EntityManager, QueryFailedError } from 'typeorm';
import { AuditService } from '../audit/audit.service.js';
import type { SessionUser } from '../auth/session-user.js';
import {
  conflict,
  type FieldIssue,
  notFound,
  validationFailed,
} from '../common/errors/app-error.js';
import type { CreateConfigurationDto } from './dto/create-configuration.dto.js';
import type { CreateObservatoryDto } from './dto/create-observatory.dto.js';
import type { CreateReceiverBandDto } from './dto/create-receiver-band.dto.js';
import type { UpdateConfigurationDto } from './dto/update-configuration.dto.js';
import type { UpdateObservatoryDto } from './dto/update-observatory.dto.js';
import type { UpdateReceiverBandDto } from './dto/update-receiver-band.dto.js';
import { Configuration } from './entities/configuration.entity.js';
import { Observatory } from './entities/observatory.entity.js';
import { ReceiverBand } from './entities/receiver-band.entity.js';

const pgCode = (error: unknown): string | undefined =>
  error instanceof QueryFailedError ? (error as unknown as { code?: string }).code : undefined;

const CHILD_NAMES = new Map<unknown, string>([
  [Configuration, 'Configuration'],
  [ReceiverBand, 'Receiver band'],
]);

/** Fields that differ between a record and a patch, as { field: { from, to } } for the audit log. */
function changes<T extends object>(before: T, patch: Partial<T>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, to] of Object.entries(patch)) {
    const from = (before as Record<string, unknown>)[key];
    if (to !== undefined && JSON.stringify(from) !== JSON.stringify(to)) out[key] = { from, to };
  }
  return out;
}

/** The array's description: the observatory, its configurations and its receiver bands. */
@Injectable()
export class ObservatoryService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  list(): Promise<Observatory[]> {
    return this.dataSource.getRepository(Observatory).find({
      relations: { configurations: true, bands: true },
      order: { name: 'ASC' },
    });
  }

  /** The observatory with its configurations and bands; 404 for an unknown or malformed id. */
  async get(id: string, manager: EntityManager = this.dataSource.manager): Promise<Observatory> {
    const found = isUUID(id)
      ? await manager.findOne(Observatory, {
          where: { id },
          relations: { configurations: true, bands: true },
        })
      : null;
    if (!found) throw notFound('Observatory');
    return found;
  }

  async create(dto: CreateObservatoryDto, actor: SessionUser): Promise<Observatory> {
    return this.dataSource.transaction(async (manager) => {
      const saved = await this.saveUnique(manager, () =>
        manager.save(Observatory, manager.create(Observatory, { beamFactor: 1.13, ...dto })),
      );
      await this.audit.record(
        {
          actorId: actor.id,
          action: 'observatory.created',
          subjectType: 'observatory',
          subjectId: saved.id,
          details: { name: saved.name },
        },
        manager,
      );
      return this.get(saved.id, manager);
    });
  }

  async update(id: string, dto: UpdateObservatoryDto, actor: SessionUser): Promise<Observatory> {
    return this.dataSource.transaction(async (manager) => {
      const observatory = await this.get(id, manager);
      const changed = changes(observatory, dto);
      if (Object.keys(changed).length > 0) {
        await this.saveUnique(manager, () => manager.update(Observatory, { id }, dto));
        await this.audit.record(
          {
            actorId: actor.id,
            action: 'observatory.updated',
            subjectType: 'observatory',
            subjectId: id,
            details: { changes: changed },
          },
          manager,
        );
      }
      return this.get(id, manager);
    });
  }

  async addConfiguration(
    observatoryId: string,
    dto: CreateConfigurationDto,
    actor: SessionUser,
  ): Promise<Configuration> {
    return this.dataSource.transaction(async (manager) => {
      await this.get(observatoryId, manager);
      const merged = { inUseTo: null, ...dto };
      assertConfigurationConsistent(merged);
      const saved = await this.saveUnique(manager, () =>
        manager.save(Configuration, manager.create(Configuration, { ...merged, observatoryId })),
      );
      await this.record(manager, actor, 'configuration.created', saved.id, { name: saved.name });
      return saved;
    });
  }

  async updateConfiguration(
    observatoryId: string,
    id: string,
    dto: UpdateConfigurationDto,
    actor: SessionUser,
  ): Promise<Configuration> {
    return this.dataSource.transaction(async (manager) => {
      const configuration = await this.findChild(manager, Configuration, observatoryId, id);
      assertConfigurationConsistent({ ...configuration, ...dto });
      const changed = changes(configuration, dto);
      if (Object.keys(changed).length > 0) {
        await this.saveUnique(manager, () => manager.update(Configuration, { id }, dto));
        await this.record(manager, actor, 'configuration.updated', id, { changes: changed });
      }
      return manager.findOneByOrFail(Configuration, { id });
    });
  }

  async removeConfiguration(observatoryId: string, id: string, actor: SessionUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const configuration = await this.findChild(manager, Configuration, observatoryId, id);
      await this.deleteUnlessUsed(
        () => manager.delete(Configuration, { id }),
        `Configuration ${configuration.name} has hours on offer in a call; take it out of the call first`,
      );
      await this.record(manager, actor, 'configuration.deleted', id, { name: configuration.name });
    });
  }

  async addBand(
    observatoryId: string,
    dto: CreateReceiverBandDto,
    actor: SessionUser,
  ): Promise<ReceiverBand> {
    return this.dataSource.transaction(async (manager) => {
      await this.get(observatoryId, manager);
      const merged = { ieeeLetter: null, ...dto };
      assertBandConsistent(merged);
      const saved = await this.saveUnique(manager, () =>
        manager.save(ReceiverBand, manager.create(ReceiverBand, { ...merged, observatoryId })),
      );
      await this.record(manager, actor, 'receiver_band.created', saved.id, { name: saved.name });
      return saved;
    });
  }

  async updateBand(
    observatoryId: string,
    id: string,
    dto: UpdateReceiverBandDto,
    actor: SessionUser,
  ): Promise<ReceiverBand> {
    return this.dataSource.transaction(async (manager) => {
      const band = await this.findChild(manager, ReceiverBand, observatoryId, id);
      assertBandConsistent({ ...band, ...dto });
      const changed = changes(band, dto);
      if (Object.keys(changed).length > 0) {
        await this.saveUnique(manager, () => manager.update(ReceiverBand, { id }, dto));
        await this.record(manager, actor, 'receiver_band.updated', id, { changes: changed });
      }
      return manager.findOneByOrFail(ReceiverBand, { id });
    });
  }

  async removeBand(observatoryId: string, id: string, actor: SessionUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const band = await this.findChild(manager, ReceiverBand, observatoryId, id);
      await this.deleteUnlessUsed(
        () => manager.delete(ReceiverBand, { id }),
        `Receiver band ${band.name} is used by proposals and cannot be removed`,
      );
      await this.record(manager, actor, 'receiver_band.deleted', id, { name: band.name });
    });
  }

  private async findChild<T extends Configuration | ReceiverBand>(
    manager: EntityManager,
    entity: new () => T,
    observatoryId: string,
    id: string,
  ): Promise<T> {
    const what = CHILD_NAMES.get(entity) ?? 'Record';
    if (!isUUID(observatoryId) || !isUUID(id)) throw notFound(what);
    const found = await manager.findOne(entity, {
      where: { id, observatoryId } as never,
      lock: { mode: 'pessimistic_write' },
    });
    if (!found) throw notFound(what);
    return found;
  }

  /** A duplicate name answers 409 naming the field, rather than the generic unique-violation text. */
  private async saveUnique<R>(manager: EntityManager, write: () => Promise<R>): Promise<R> {
    try {
      return await write();
    } catch (error) {
      if (pgCode(error) === '23505') {
        throw validationFailed(
          [{ path: 'name', message: 'name is already used in this observatory' }],
          'That name is already used',
        );
      }
      throw error;
    }
  }

  private async deleteUnlessUsed(remove: () => Promise<unknown>, message: string): Promise<void> {
    try {
      await remove();
    } catch (error) {
      if (pgCode(error) === '23503') throw conflict('IN_USE', message);
      throw error;
    }
  }

  private record(
    manager: EntityManager,
    actor: SessionUser,
    action: string,
    subjectId: string,
    details: Record<string, unknown>,
  ): Promise<void> {
    const subjectType = action.split('.')[0] as string;
    return this.audit.record(
      { actorId: actor.id, action, subjectType, subjectId, details },
      manager,
    );
  }
}

function assertConfigurationConsistent(c: {
  shortestBaselineM: number;
  longestBaselineM: number;
  inUseFrom: string;
  inUseTo?: string | null;
}): void {
  const issues: FieldIssue[] = [];
  if (c.longestBaselineM < c.shortestBaselineM)
    issues.push({
      path: 'longestBaselineM',
      message: `longestBaselineM (${c.longestBaselineM} m) must not be shorter than shortestBaselineM (${c.shortestBaselineM} m)`,
    });
  if (c.inUseTo && c.inUseTo < c.inUseFrom)
    issues.push({
      path: 'inUseTo',
      message: `inUseTo (${c.inUseTo}) must not be before inUseFrom (${c.inUseFrom})`,
    });
  if (issues.length) throw validationFailed(issues);
}

function assertBandConsistent(b: {
  minGHz: number;
  maxGHz: number;
  maxBandwidthMHz: number;
}): void {
  const issues: FieldIssue[] = [];
  if (b.maxGHz <= b.minGHz)
    issues.push({
      path: 'maxGHz',
      message: `maxGHz (${b.maxGHz}) must be above minGHz (${b.minGHz})`,
    });
  else if (b.maxBandwidthMHz > (b.maxGHz - b.minGHz) * 1000)
    issues.push({
      path: 'maxBandwidthMHz',
      message: `maxBandwidthMHz (${b.maxBandwidthMHz}) cannot exceed the band's width (${Math.round((b.maxGHz - b.minGHz) * 1000)} MHz)`,
    });
  if (issues.length) throw validationFailed(issues);
}

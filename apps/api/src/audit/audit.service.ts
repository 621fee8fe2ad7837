import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity.js';

export interface AuditEntry {
  actorId: string | null;
  action: string;
  subjectType?: string;
  subjectId?: string;
  details?: Record<string, unknown>;
  ip?: string | null;
}

/** Writes the audit log; pass the transaction's manager so the entry commits with the change. */
@Injectable()
export class AuditService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async record(entry: AuditEntry, manager: EntityManager = this.dataSource.manager): Promise<void> {
    const event = manager.create(AuditEvent, {
      actorId: entry.actorId,
      action: entry.action,
      subjectType: entry.subjectType ?? null,
      subjectId: entry.subjectId ?? null,
      details: entry.details ?? {},
      ip: entry.ip ?? null,
    });
    await manager.save(event);
  }
}

import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { DataSource, EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity.js';
import type { AuditEventResponse } from './dto/audit-event.response.js';
import type { ListAuditQuery } from './dto/list-audit.query.js';

export interface AuditEntry {
  actorId: string | null;
  action: string;
  subjectType?: string;
  subjectId?: string;
  details?: Record<string, unknown>;
  ip?: string | null;
}

interface AuditRow {
  id: string;
  at: Date;
  action: string;
  subject_type: string | null;
  subject_id: string | null;
  details: Record<string, unknown>;
  ip: string | null;
  actor_id: string | null;
  actor_name: string | null;
  actor_email: string | null;
  subject_name: string | null;
  subject_email: string | null;
  total: string;
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

  /** Newest first, with the actor's name; filtered by action (or prefix) and by account. */
  async list(query: ListAuditQuery): Promise<{ items: AuditEventResponse[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    if (query.action) {
      params.push(query.action.endsWith('.') ? `${query.action}%` : query.action);
      where.push(
        query.action.endsWith('.')
          ? `e.action LIKE $${params.length}`
          : `e.action = $${params.length}`,
      );
    }
    if (query.userId) {
      params.push(query.userId);
      where.push(
        `(e.actor_id = $${params.length} OR (e.subject_type = 'user' AND e.subject_id = $${params.length}::text))`,
      );
    }
    params.push(query.pageSize, (query.page - 1) * query.pageSize);
    const rows: AuditRow[] = await this.dataSource.query(
      `SELECT e.id::text AS id, e.at, e.action, e.subject_type, e.subject_id, e.details, e.ip,
              u.id AS actor_id, u.name AS actor_name, u.email AS actor_email,
              s.name AS subject_name, s.email AS subject_email,
              count(*) OVER () AS total
         FROM audit_events e
         LEFT JOIN users u ON u.id = e.actor_id
         -- subject_id is text (subjects of other kinds need not be UUIDs): compare as text.
         LEFT JOIN users s ON e.subject_type = 'user' AND s.id::text = e.subject_id
        ${where.length ? `WHERE ${where.join(' AND ')}` : ''}
        ORDER BY e.at DESC, e.id DESC
        LIMIT $${params.length - 1} OFFSET $${params.length}`,
      params,
    );
    const total = rows[0] ? Number(rows[0].total) : await this.count(where, params.slice(0, -2));
    return {
      total,
      items: rows.map((row) => ({
        id: row.id,
        at: row.at.toISOString(),
        actor:
          row.actor_id && row.actor_name && row.actor_email
            ? { id: row.actor_id, name: row.actor_name, email: row.actor_email }
            : null,
        action: row.action,
        subject:
          row.subject_id && row.subject_name && row.subject_email
            ? { id: row.subject_id, name: row.subject_name, email: row.subject_email }
            : null,
        subjectType: row.subject_type,
        subjectId: row.subject_id,
        details: row.details,
        ip: row.ip,
      })),
    };
  }

  /** The total when the page is past the end (the window count then has no row to ride on). */
  private async count(where: string[], params: unknown[]): Promise<number> {
    const [row]: [{ n: string }] = await this.dataSource.query(
      `SELECT count(*) AS n FROM audit_events e ${where.length ? `WHERE ${where.join(' AND ')}` : ''}`,
      params,
    );
    return Number(row.n);
  }
}

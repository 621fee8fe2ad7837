import { AccountToken } from '../users/entities/account-token.entity.js';
import { AppMeta } from '../app-meta/app-meta.entity.js';
import { AuditEvent } from '../audit/audit-event.entity.js';
import { OutboxMessage } from '../mail/outbox-message.entity.js';
import { User } from '../users/entities/user.entity.js';

/** Every entity, listed once; a feature module adds its entities here and to its forFeature(). */
export const entities = [AccountToken, AppMeta, AuditEvent, OutboxMessage, User];

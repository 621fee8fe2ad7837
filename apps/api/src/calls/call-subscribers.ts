import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { Call } from './entities/call.entity.js';

/**
 * Who hears about changes to an open call: every PI with a draft proposal in it (the calls
 * service mails whatever this returns).
 */
@Injectable()
export class CallSubscribers {
  async addressesFor(call: Call, manager: EntityManager): Promise<string[]> {
    const rows = (await manager.query(
      `SELECT DISTINCT u.email FROM proposals p
         JOIN proposal_members m ON m.proposal_id = p.id AND m.role = 'pi'
         JOIN users u ON u.id = m.user_id AND u.active
        WHERE p.call_id = $1 AND p.status = 'draft'
        ORDER BY u.email`,
      [call.id],
    )) as { email: string }[];
    return rows.map((r) => r.email);
  }
}

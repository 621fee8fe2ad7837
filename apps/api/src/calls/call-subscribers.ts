import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { Call } from './entities/call.entity.js';

/**
 * Who hears about changes to an open call: every PI with a draft proposal in it. Proposals do
 * not exist yet, so nobody is subscribed; the proposals feature replaces the body of
 * `addressesFor` with a query on its drafts (the calls service already mails whatever it returns).
 */
@Injectable()
export class CallSubscribers {
  async addressesFor(_call: Call, _manager: EntityManager): Promise<string[]> {
    return [];
  }
}

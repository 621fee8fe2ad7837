import { ObservationGrant } from './observation-grant.entity.js';
import { ProposalGrant } from './proposal-grant.entity.js';

/** The entities of the allocation module, listed once: database/entities.ts and the module use this list. */
export const allocationEntities: (new () => object)[] = [ProposalGrant, ObservationGrant];

import type { RightsRow } from './rights.js';

/** Rows of the rights matrix for the desk module's routes (rights-matrix.e2e-spec.ts spreads them). */
export const DESK_ROWS: RightsRow[] = [
  {
    route: 'GET /api/desk',
    expect: {
      anonymous: 401,
      unverified: 200,
      proposer: 200,
      referee: 200,
      chair: 200,
      staff: 200,
      admin: 200,
    },
    note: 'Anyone signed in has a Desk; it only ever lists their own work, per role held',
  },
];

/** Route prefixes under which every served route of the desk module must have a row. */
export const DESK_MATRIX_PREFIXES: string[] = ['/api/desk'];

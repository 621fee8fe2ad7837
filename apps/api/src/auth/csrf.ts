import { csrfSync } from 'csrf-sync';
import type { Request } from 'express';

/**
 * Synchronizer-token CSRF protection (csrf-sync): the token lives in the server-side session and
 * must come back in the X-CSRF-Token header of every state-changing request.
 */
export const csrf = csrfSync({
  size: 32,
  getTokenFromRequest: (req: Request) => req.get('x-csrf-token') ?? undefined,
});

import type { Request } from 'express';

/** Who is acting and from where, for the audit log. */
export interface RequestOrigin {
  actorId: string | null;
  /** The client's address as Express sees it (behind TRUST_PROXY, from X-Forwarded-For). */
  ip: string | null;
}

export const originOf = (req: Request): RequestOrigin => ({
  actorId: req.user?.id ?? null,
  ip: req.ip ?? null,
});

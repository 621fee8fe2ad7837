import type { GlobalRole, Role } from '../users/entities/user.entity.js';

export interface CallRoleGrant {
  callCode: string;
  role: 'chair' | 'referee';
}

/** The signed-in user as every request sees it (req.user), reloaded per request. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  affiliation: string;
  country: string;
  orcid: string | null;
  emailVerified: boolean;
  globalRoles: GlobalRole[];
  callRoles: CallRoleGrant[];
  /** Every role the user can act in now. */
  roles: Role[];
  sessionEpoch: number;
}

/** What the session cookie's row holds: enough to reload the user and to notice an ended epoch. */
export interface SerializedSession {
  id: string;
  epoch: number;
}

declare module 'express-session' {
  interface SessionData {
    signedInAt?: number;
    /** Where passport keeps the serialized user. */
    passport?: { user?: SerializedSession };
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

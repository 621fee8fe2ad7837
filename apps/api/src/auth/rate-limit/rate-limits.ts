/** How many requests a tracker (an address, an account) may make in a window before a 429. */
export interface Limit {
  limit: number;
  windowSeconds: number;
}

export interface RateLimitRule {
  perIp?: Limit;
  /** Per account: the e-mail in the request body, or the signed-in user. */
  perAccount?: Limit & { by: 'body-email' | 'signed-in-user' };
}

/**
 * The limits, in one place. The per-address limits leave room for many people behind one
 * institute's address; the per-account ones stop guessing at one account and the sending of many
 * e-mails to one inbox.
 *
 * Sign-in (and a password change's check of the current password) counts failures only, so a
 * person who signs in and out often is never slowed down; see SignInLimiter.
 */
export const SIGN_IN_FAILURE_LIMITS = {
  perIp: { limit: 30, windowSeconds: 15 * 60 },
  perAccount: { limit: 10, windowSeconds: 15 * 60 },
} as const satisfies Record<string, Limit>;

/** Routes limited with @RateLimit count every request. */
export const RATE_LIMITS = {
  register: {
    perIp: { limit: 20, windowSeconds: 60 * 60 },
    perAccount: { limit: 3, windowSeconds: 60 * 60, by: 'body-email' },
  },
  passwordReset: {
    perIp: { limit: 20, windowSeconds: 60 * 60 },
    perAccount: { limit: 3, windowSeconds: 60 * 60, by: 'body-email' },
  },
  /** Redeeming an e-mailed token: guessing one is hopeless, but there is no reason to allow it. */
  token: {
    perIp: { limit: 30, windowSeconds: 15 * 60 },
  },
  resendVerification: {
    perAccount: { limit: 3, windowSeconds: 60 * 60, by: 'signed-in-user' },
  },
} as const satisfies Record<string, RateLimitRule>;

import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { AppConfig } from '../config/app-config.js';

export const SESSION_COOKIE = 'skyhours.sid';

/**
 * Server-side sessions in PostgreSQL (the `session` table comes from a migration). The cookie is
 * httpOnly and SameSite=Lax, Secure behind https; it rolls with use (idle expiry) and the session
 * also ends a fixed time after sign-in (absolute expiry, see `absoluteExpiry`).
 */
export function sessionMiddleware(config: AppConfig, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    name: SESSION_COOKIE,
    secret: config.get('SESSION_SECRET'),
    store: new PgStore({
      pool,
      tableName: 'session',
      createTableIfMissing: false,
      pruneSessionInterval: 15 * 60,
    }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.get('TRUST_PROXY'),
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: 'auto',
      path: '/',
      maxAge: config.get('SESSION_IDLE_MINUTES') * 60_000,
    },
  });
}

/** Ends a session that is older than the absolute limit, whatever its activity. */
export function absoluteExpiry(config: AppConfig): RequestHandler {
  const limitMs = config.get('SESSION_ABSOLUTE_HOURS') * 3_600_000;
  return (req, _res, next) => {
    const signedInAt = req.session?.signedInAt;
    if (req.user && signedInAt !== undefined && Date.now() - signedInAt > limitMs) {
      req.session.destroy(() => {
        req.user = undefined;
        next();
      });
      return;
    }
    next();
  };
}

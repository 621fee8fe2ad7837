import { existsSync } from 'node:fs';
import { join } from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';
import helmet from 'helmet';
import passport from 'passport';
import pg from 'pg';
import { absoluteExpiry, sessionMiddleware } from './auth/session.js';
import { toEnvelope } from './common/filters/error-envelope.filter.js';
import { createValidationPipe } from './common/validation.js';
import { AppConfig } from './config/app-config.js';
import { VERSION } from './version.js';

export const API_PREFIX = 'api';

/**
 * Everything around the routes: security headers, body limits, sessions, validation, the OpenAPI
 * description and the built web app. main.ts and the e2e tests both call this, so tests run the
 * app exactly as it is served.
 */
export function configureApp(app: NestExpressApplication): { close(): Promise<void> } {
  const config = app.get(AppConfig);
  if (config.get('TRUST_PROXY')) app.set('trust proxy', 1);

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // The OpenAPI page's inline bootstrap script needs this; the web app itself does not.
          'script-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.useBodyParser('json', { limit: '1mb' });
  app.useBodyParser('urlencoded', { limit: '1mb', extended: false });

  const pool = new pg.Pool({ connectionString: config.get('DATABASE_URL'), max: 5 });
  pool.on('error', () => undefined); // a dropped idle connection is replaced on next use
  app.use(sessionMiddleware(config, pool));
  app.use(passport.initialize());
  app.use(passport.session());
  app.use(absoluteExpiry(config));

  app.setGlobalPrefix(API_PREFIX);
  app.useGlobalPipes(createValidationPipe());

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Skyhours API')
      .setDescription(
        'Calls for proposals, review, allocation and observing plans. Sign in with POST /api/auth/login; send X-CSRF-Token from GET /api/auth/csrf on every write.',
      )
      .setVersion(VERSION)
      .addCookieAuth('skyhours.sid')
      .build(),
  );
  SwaggerModule.setup(`${API_PREFIX}/docs`, app, document, {
    jsonDocumentUrl: `${API_PREFIX}/docs/openapi.json`,
  });

  serveWebApp(app, config.get('WEB_DIST'));

  // Errors raised by Express middleware before Nest's routing (bad JSON, oversized bodies).
  app.use((error: unknown, _req: Request, res: Response, next: NextFunction) => {
    if (res.headersSent) return next(error);
    const envelope = toEnvelope(error);
    res.status(envelope.statusCode).json(envelope);
  });

  return { close: () => pool.end() };
}

/** The built web app on the same origin: static files, and index.html for client-side routes. */
function serveWebApp(app: NestExpressApplication, dist: string | undefined): void {
  if (!dist || !existsSync(join(dist, 'index.html'))) return;
  app.use(
    '/assets',
    express.static(join(dist, 'assets'), { immutable: true, maxAge: '1y', index: false }),
  );
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (
      req.method !== 'GET' ||
      req.path.startsWith(`/${API_PREFIX}/`) ||
      req.path === `/${API_PREFIX}`
    )
      return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(join(dist, 'index.html'));
  });
}

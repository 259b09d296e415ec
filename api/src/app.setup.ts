import type { INestApplication } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type { NestExpressApplication } from '@nestjs/platform-express';
import compression from 'compression';
import { RedisStore } from 'connect-redis';
import express, { type NextFunction, type Request, type Response } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import passport from 'passport';
import { SESSION_COOKIE } from './auth/session.constants';
import { readBearerToken } from './common/bearer-token';
import { csrfMiddleware } from './common/middleware/csrf.middleware';
import { hostCheckMiddleware } from './common/middleware/host-check.middleware';
import type { AppConfig } from './config/app.config';
import type { MailConfig } from './config/mail.config';
import { setupOpenApi } from './openapi/openapi.setup';
import { REDIS_CLIENT, type RedisClient } from './redis/redis.module';

/**
 * Everything around the routes, in one place so that main.ts and the end-to-end tests run
 * the same stack: the Host and Origin check, security headers, compressed answers, JSON bodies, sessions in Redis,
 * passport, CSRF, the `/api` prefix, the OpenAPI document and the built web app with its
 * client-side routes.
 */
export function configureApp(nestApp: INestApplication): void {
  const app = nestApp as NestExpressApplication;
  const config = app.get(ConfigService).getOrThrow<AppConfig>('app');
  const { appUrl } = app.get(ConfigService).getOrThrow<MailConfig>('mail');
  const redis = app.get<RedisClient>(REDIS_CLIENT);

  if (config.trustProxy) app.set('trust proxy', 1);
  // First, so that a request for another host name gets no session, no file and no route.
  app.use(hostCheckMiddleware({ appUrl, extra: config.allowedHosts, loopback: config.allowLoopbackHosts }));
  app.disable('x-powered-by');
  // The API docs page (/api/docs) fits this policy as is: swagger-ui-dist's scripts are files served
  // from here (no inline script), its inline <style> is allowed below, and its icons are data: URIs.
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          // Chakra (emotion) and Plotly write style attributes and <style> elements at run time.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'worker-src': ["'self'", 'blob:'],
          'connect-src': ["'self'"],
        },
      },
    }),
  );
  app.use(compressedAnswers());
  app.useBodyParser('json', { limit: '2mb' });
  const sessions = session({
    name: SESSION_COOKIE,
    store: new RedisStore({ client: redis, prefix: 'sixtyfold:sess:' }),
    secret: config.sessionSecret,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      maxAge: config.sessionTtlSeconds * 1000,
      path: '/',
    },
  });
  const passportSessions = passport.session();
  // A bearer-token request is authenticated by its token alone (AccessGuard): no session is read,
  // created or prolonged for it, so one request never mixes two identities.
  const unlessBearer = (middleware: express.RequestHandler): express.RequestHandler => (req, res, next) =>
    readBearerToken(req) === undefined ? middleware(req, res, next) : next();
  app.use(unlessBearer(sessions));
  app.use(passport.initialize());
  app.use(unlessBearer(passportSessions));
  app.use('/api', csrfMiddleware);
  app.setGlobalPrefix('api');
  setupOpenApi(app);
  serveWebApp(app, config.webDistDir);
}

/**
 * gzip or brotli, as the client's Accept-Encoding prefers, for answers of 1 kB and more whose type
 * compresses (JSON, CSV, text; `compressible` knows archives and images are compressed already).
 * Every write is flushed through the compressor: a streamed export writes batches of about 64 kB, and
 * each leaves at once rather than waiting in zlib, so a download starts as soon as its first rows are read.
 */
function compressedAnswers(): express.RequestHandler {
  return compression({
    flush: zlib.constants.Z_SYNC_FLUSH,
    brotli: { flush: zlib.constants.BROTLI_OPERATION_FLUSH },
  });
}

function serveWebApp(app: NestExpressApplication, distDir: string): void {
  const indexHtml = path.join(distDir, 'index.html');
  if (!existsSync(indexHtml)) return; // API-only deployments and the API's own tests
  app.use(express.static(distDir, { index: false, maxAge: '1h' }));
  // Client-side routes (/scans/12, /models) all load the app shell.
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || req.path.startsWith('/api')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}

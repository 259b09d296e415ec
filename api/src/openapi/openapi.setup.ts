import type { INestApplication } from '@nestjs/common';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import { API_TOKEN_PREFIX } from '@sixtyfold/shared';
import { SESSION_COOKIE } from '../auth/session.constants';
import { SESSION_SCHEME, TOKEN_SCHEME } from './security-schemes';

/** The interactive documentation page; its assets (swagger-ui-dist) are served from below it. */
export const DOCS_PATH = '/api/docs';
/** The OpenAPI 3 document itself, for code generators and scripts. */
export const OPENAPI_JSON_PATH = '/api/docs/openapi.json';

/**
 * Serves the OpenAPI document, built on first request from the routes and their zod schemas.
 * These routes are plain Express handlers, outside Nest's router, so the global AccessGuard never
 * sees them: the documentation is public by design (it describes the API, it holds no data).
 */
export function setupOpenApi(app: INestApplication): void {
  const config = new DocumentBuilder()
    .setTitle('Sixtyfold API')
    .setDescription(
      'Parameter scans of inflationary potentials. Authenticate with the session cookie from ' +
        '`POST /api/auth/login`, or with a personal API token created in the app (API tokens page) sent as ' +
        `\`Authorization: Bearer ${API_TOKEN_PREFIX}…\`. A token acts as its user, with the user's current roles; ` +
        'signing in and out and managing tokens need a session.',
    )
    .setVersion('1')
    .addCookieAuth(SESSION_COOKIE, { type: 'apiKey', in: 'cookie', name: SESSION_COOKIE, description: 'Set by POST /api/auth/login' }, SESSION_SCHEME)
    .addBearerAuth({ type: 'http', scheme: 'bearer', bearerFormat: `${API_TOKEN_PREFIX}…`, description: 'A personal API token' }, TOKEN_SCHEME)
    // Every route takes either credential unless it says otherwise (public routes, session-only routes).
    .addSecurityRequirements(SESSION_SCHEME)
    .addSecurityRequirements(TOKEN_SCHEME)
    .build();
  SwaggerModule.setup(DOCS_PATH, app, () => SwaggerModule.createDocument(app, config), {
    jsonDocumentUrl: OPENAPI_JSON_PATH,
    raw: ['json'],
    customSiteTitle: 'Sixtyfold API',
    // The UI would otherwise show a badge image fetched from an outside validator, which the CSP blocks anyway.
    swaggerOptions: { validatorUrl: null },
  });
}

import { ForbiddenException, UnsupportedMediaTypeException } from '@nestjs/common';
import type { NextFunction, Request, Response } from 'express';
import { readBearerToken } from '../bearer-token';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence for a same-origin single-page app whose session cookie is SameSite=Lax:
 * 1. a browser's cross-site request is refused outright (Fetch Metadata `Sec-Fetch-Site`,
 *    and `Origin` when it names another host);
 * 2. a state-changing request must be JSON, or carry our `X-Sixtyfold-Request` header (uploads).
 *    Neither can be sent cross-origin without a CORS preflight, which this API never grants,
 *    so a forged HTML form or no-cors fetch cannot reach a handler.
 * Bearer-token requests carry no ambient credential and skip rule 2.
 */
export function csrfMiddleware(req: Request, _res: Response, next: NextFunction): void {
  if (SAFE_METHODS.has(req.method)) return next();
  const fetchSite = req.get('sec-fetch-site');
  if (fetchSite === 'cross-site' || fetchSite === 'same-site') {
    return next(new ForbiddenException('Cross-site requests are refused'));
  }
  const origin = req.get('origin');
  if (origin && origin !== 'null') {
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(new ForbiddenException('The Origin header is not a valid address'));
    }
    if (host !== req.get('host')) return next(new ForbiddenException(`Requests from ${origin} are refused`));
  } else if (origin === 'null') {
    return next(new ForbiddenException('Requests from an opaque origin are refused'));
  }
  if (readBearerToken(req) !== undefined) return next();
  if (req.is('application/json') || req.get('x-sixtyfold-request')) return next();
  next(new UnsupportedMediaTypeException('Send the request body as JSON (Content-Type: application/json)'));
}

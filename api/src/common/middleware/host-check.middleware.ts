import { ForbiddenException, HttpException, HttpStatus } from '@nestjs/common';
import type { NextFunction, Request, RequestHandler, Response } from 'express';

const LOOPBACK_NAMES = new Set(['127.0.0.1', 'localhost', '[::1]']);
// What a Host header or an ALLOWED_HOSTS entry may hold: a name or address, and a port.
export const HOST_SYNTAX = /^(\[[0-9a-f:.]+\]|[a-z0-9.-]+)(:\d{1,5})?$/i;
// Load balancers and the start scripts poll it by whatever address reaches the machine; it holds no data.
const HEALTH_PATH = '/api/health';

export interface AllowedHostsOptions {
  /** The address people open (APP_URL); its host is always allowed. */
  appUrl: string;
  /** Further host names or host:port entries (ALLOWED_HOSTS). */
  extra: string[];
  /** 127.0.0.1, localhost and [::1] on any port (every profile but production). */
  loopback: boolean;
}

/** `name` or `name:port` in lower case, without the default ports 80 and 443; null for anything else. */
function hostKey(host: string): { name: string; key: string } | null {
  if (!HOST_SYNTAX.test(host)) return null;
  let url: URL;
  try {
    url = new URL(`http://${host}`);
  } catch {
    return null;
  }
  const port = url.port === '443' ? '' : url.port;
  return { name: url.hostname, key: port ? `${url.hostname}:${port}` : url.hostname };
}

/** Decides whether a host (as in a Host header or an Origin) is one this site answers for. */
export function allowedHostMatcher(options: AllowedHostsOptions): (host: string | undefined) => boolean {
  const keys = new Set<string>();
  for (const entry of [new URL(options.appUrl).host, ...options.extra]) {
    const parsed = hostKey(entry);
    if (parsed) keys.add(parsed.key);
  }
  return (host) => {
    const parsed = host ? hostKey(host) : null;
    if (!parsed) return false;
    return keys.has(parsed.key) || (options.loopback && LOOPBACK_NAMES.has(parsed.name));
  };
}

/**
 * Answers only requests addressed to this site. A page on another name that resolves to this
 * machine (DNS rebinding) sends its own name as Host: that is a 421 (Misdirected Request).
 * A browser request from a page on a foreign origin, whatever its method, is a 403. Behind a
 * trusted proxy (TRUST_PROXY) the Host is the forwarded one (Express's `req.host`).
 */
export function hostCheckMiddleware(options: AllowedHostsOptions): RequestHandler {
  const allowed = allowedHostMatcher(options);
  return (req: Request, _res: Response, next: NextFunction) => {
    const host = req.host;
    if (!allowed(host) && req.path !== HEALTH_PATH) {
      const named = host ? `"${host}"` : 'no host';
      return next(new HttpException(
        `This server does not answer for ${named}; open the site at its own address (an operator adds further names to ALLOWED_HOSTS)`,
        HttpStatus.MISDIRECTED,
      ));
    }
    const origin = req.get('origin');
    // "null" (sandboxed frames, some redirects) names no site; the CSRF check refuses it for changes.
    if (origin && origin !== 'null') {
      let originHost: string | undefined;
      try {
        originHost = new URL(origin).host;
      } catch {
        return next(new ForbiddenException('The Origin header is not a valid address'));
      }
      if (!allowed(originHost)) return next(new ForbiddenException(`Requests from pages on ${origin} are refused`));
    }
    next();
  };
}

import { vi } from 'vitest';

export interface MockRequest {
  method: string;
  url: URL;
  headers: Headers;
  /** The parsed JSON body, or the FormData of an upload. */
  body: unknown;
  credentials: RequestCredentials | undefined;
}

type Handler = (request: MockRequest) => Response | Promise<Response>;

export const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

export const apiError = (statusCode: number, message: string, fieldErrors?: Record<string, string[]>, line?: number) =>
  json(statusCode, { statusCode, error: 'Error', message, ...(fieldErrors ? { fieldErrors } : {}), ...(line !== undefined ? { line } : {}) });

/**
 * Replaces global fetch with a table of `"METHOD /api/path"` handlers. Unknown requests answer 500
 * so a test notices calls it did not expect. Returns the recorded requests.
 */
export function mockApi(handlers: Record<string, Handler>) {
  const requests: MockRequest[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = new URL(String(input), 'http://sixtyfold.test');
    const method = (init.method ?? 'GET').toUpperCase();
    const body = typeof init.body === 'string' ? (JSON.parse(init.body) as unknown) : init.body instanceof FormData ? init.body : undefined;
    const request: MockRequest = { method, url, headers: new Headers(init.headers), body, credentials: init.credentials };
    requests.push(request);
    const handler = handlers[`${method} ${url.pathname}`];
    return handler ? handler(request) : apiError(500, `No mock for ${method} ${url.pathname}`);
  });
  vi.stubGlobal('fetch', fetchMock);
  return { requests, fetchMock };
}

import { apiErrorSchema, type ApiError } from '@sixtyfold/shared';
import type { z } from 'zod';
import { env } from '@/config/env';

/** Thrown for every failed request; `status` is 0 when the server could not be reached. */
export class ApiRequestError extends Error {
  readonly status: number;
  readonly fieldErrors: Record<string, string[]>;
  /** For a refused upload: the 1-based line of the file the message is about. */
  readonly line: number | undefined;

  constructor(status: number, message: string, fieldErrors: ApiError['fieldErrors'] = {}, line?: number) {
    super(message);
    this.name = 'ApiRequestError';
    this.status = status;
    this.fieldErrors = fieldErrors ?? {};
    this.line = line;
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type Query = Record<string, string | number | undefined>;

interface RequestOptions<S extends z.ZodType | undefined> {
  body?: unknown;
  /** A multipart body (file uploads) instead of JSON. */
  form?: FormData;
  query?: Query;
  schema?: S;
  signal?: AbortSignal;
}

type Result<S> = S extends z.ZodType ? z.output<S> : undefined;

// Used when the body is not an ApiError (a proxy page, an empty 502...).
const fallbackMessages: Record<number, string> = {
  401: 'You are not signed in.',
  403: 'You do not have access to this.',
  404: 'Not found.',
  429: 'Too many attempts, wait a minute.',
};

function buildUrl(path: string, query?: Query): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) {
    if (value !== undefined && value !== '') search.set(key, String(value));
  }
  const qs = search.toString();
  return `${env.VITE_API_BASE_PATH}${path}${qs ? `?${qs}` : ''}`;
}

async function readError(response: Response): Promise<ApiRequestError> {
  const text = await response.text().catch(() => '');
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    body = undefined;
  }
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) return new ApiRequestError(response.status, parsed.data.message, parsed.data.fieldErrors, parsed.data.line);
  const message =
    fallbackMessages[response.status] ??
    (response.status >= 500 ? 'The Sixtyfold server had a problem.' : `The request failed (HTTP ${response.status}).`);
  return new ApiRequestError(response.status, message);
}

async function request<S extends z.ZodType | undefined = undefined>(
  method: Method,
  path: string,
  { body, form, query, schema, signal }: RequestOptions<S> = {},
): Promise<Result<S>> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const init: RequestInit = { method, headers, credentials: 'same-origin', signal };
  if (form) {
    // Not JSON, so the API's CSRF defence wants our own header; the browser sets the multipart boundary.
    headers['X-Sixtyfold-Request'] = 'upload';
    init.body = form;
  } else if (method !== 'GET') {
    // The API's CSRF defence only accepts JSON bodies on state-changing requests, so always send one.
    headers['Content-Type'] = 'application/json';
    init.body = JSON.stringify(body ?? {});
  }

  let response: Response;
  try {
    response = await fetch(buildUrl(path, query), init);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiRequestError(0, 'Could not reach the Sixtyfold server.');
  }
  if (!response.ok) throw await readError(response);
  if (!schema || response.status === 204) return undefined as Result<S>;

  const data: unknown = await response.json().catch(() => undefined);
  const parsed = schema.safeParse(data);
  // A shape mismatch means web and API versions disagree; say so rather than render garbage.
  if (!parsed.success) {
    throw new ApiRequestError(response.status, 'The server sent data this version of the app does not understand.');
  }
  return parsed.data as Result<S>;
}

export const api = {
  get: <S extends z.ZodType>(path: string, options: Omit<RequestOptions<S>, 'body'> & { schema: S }) =>
    request('GET', path, options),
  post: <S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}) =>
    request('POST', path, options),
  /** POSTs a multipart form (a file and its fields). */
  upload: <S extends z.ZodType | undefined = undefined>(path: string, form: FormData, options: Omit<RequestOptions<S>, 'body' | 'form'> = {}) =>
    request('POST', path, { ...options, form }),
  put: <S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}) =>
    request('PUT', path, options),
  patch: <S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}) =>
    request('PATCH', path, options),
  delete: <S extends z.ZodType | undefined = undefined>(path: string, options: RequestOptions<S> = {}) =>
    request('DELETE', path, options),
};

import type { z } from 'zod';

const CSRF_COOKIE = 'provenote_csrf';
const CSRF_HEADER = 'X-CSRF-Token';

/** An answer other than 2xx, with the API's message and, for invalid input, the fields to fix. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly errors: { path: string; message: string }[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

export const isUnauthorized = (error: unknown) => error instanceof ApiError && error.status === 401;

function readCookie(name: string): string | null {
  const match = document.cookie.split('; ').find((part) => part.startsWith(`${name}=`));
  return match ? decodeURIComponent(match.slice(name.length + 1)) : null;
}

/**
 * The double-submit CSRF token: the API sets the readable cookie on the first request; a browser that
 * has none yet (a first visit straight to a form) asks for it once.
 */
async function csrfToken(): Promise<string> {
  const existing = readCookie(CSRF_COOKIE);
  if (existing) return existing;
  const res = await fetch('/api/auth/csrf', { credentials: 'same-origin' });
  const body = (await res.json()) as { csrfToken: string };
  return readCookie(CSRF_COOKIE) ?? body.csrfToken;
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
}

/**
 * Calls the API and parses the answer with the shared schema, so an answer of the wrong shape fails here
 * with a named error rather than somewhere in a component. Pass `null` as the schema for 204 answers.
 */
export async function apiRequest<S extends z.ZodType>(
  path: string,
  schema: S | null,
  options: RequestOptions = {},
): Promise<z.infer<S>> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  if (method !== 'GET') headers[CSRF_HEADER] = await csrfToken();
  const res = await fetch(`/api${path}`, {
    method,
    headers,
    credentials: 'same-origin',
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    signal: options.signal,
  });
  const text = await res.text();
  const json: unknown = text ? JSON.parse(text) : null;
  if (!res.ok) {
    const body = (json ?? {}) as { message?: string; errors?: { path: string; message: string }[] };
    throw new ApiError(res.status, body.message ?? `The server answered ${res.status}`, body.errors ?? []);
  }
  return schema ? schema.parse(json) : (undefined as z.infer<S>);
}

/** The readable message for any error a query or mutation ends with. */
export function errorMessage(error: unknown): string {
  if (error instanceof Error) return error.message;
  return 'Something went wrong';
}

/** Field errors from a 400 answer, keyed by field name, for `form.setErrors`. */
export function fieldErrors(error: unknown): Record<string, string> {
  if (!(error instanceof ApiError)) return {};
  return Object.fromEntries(error.errors.map((e) => [e.path, e.message]));
}

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

function csrfToken(): string | null {
  const match = document.cookie.split('; ').find((part) => part.startsWith(`${CSRF_COOKIE}=`));
  return match ? decodeURIComponent(match.slice(CSRF_COOKIE.length + 1)) : null;
}

interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
}

/**
 * Calls the API and parses the answer with the shared schema, so a response of the wrong shape fails
 * here with a named error instead of somewhere in a component.
 */
export async function apiRequest<S extends z.ZodType>(
  path: string,
  schema: S,
  options: RequestOptions = {},
): Promise<z.infer<S>> {
  const method = options.method ?? 'GET';
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (options.body !== undefined) headers['Content-Type'] = 'application/json';
  const token = method === 'GET' ? null : csrfToken();
  if (token) headers[CSRF_HEADER] = token;
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
  return schema.parse(json);
}

/** The readable message for any error a query or mutation ends with. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  if (error instanceof Error) return error.message;
  return 'Something went wrong';
}

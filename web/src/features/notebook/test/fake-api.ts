import { vi } from 'vitest';

type Handler = (body: unknown) => { status?: number; body: unknown };

/**
 * Replaces fetch with answers keyed by "METHOD /path" (the query string ignored); every call is kept,
 * and a request nobody answers fails the test with its name.
 */
export function fakeApi(routes: Record<string, Handler>) {
  const calls: { key: string; body: unknown }[] = [];
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://localhost');
    const key = `${init?.method ?? 'GET'} ${url.pathname}`;
    const body = init?.body ? JSON.parse(String(init.body)) : undefined;
    calls.push({ key, body });
    const handler = routes[key];
    if (!handler) throw new Error(`no fake answer for ${key}`);
    const answer = handler(body);
    return new Response(JSON.stringify(answer.body), {
      status: answer.status ?? 200,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return { calls };
}

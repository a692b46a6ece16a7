// A stand-in for the API behind `fetch`: each test says what each route answers, and can read
// what the page sent. Anything not listed answers 404, so a page that asks for more than the test
// expects shows it rather than hanging.
import { vi } from 'vitest';

export type Call = { method: string; path: string; body: unknown };
type Answer = { status?: number; body?: unknown } | ((call: Call) => { status?: number; body?: unknown });

export function fakeServer(routes: Record<string, Answer>) {
  const calls: Call[] = [];
  const fetchStub = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input instanceof Request ? input.url : input), 'http://hotwell.test');
    const method = (init?.method ?? 'GET').toUpperCase();
    const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined;
    const call = { method, path: url.pathname + url.search, body };
    calls.push(call);
    const answer = routes[`${method} ${url.pathname}`] ?? routes[`${method} ${url.pathname}${url.search}`];
    const { status = 200, body: payload = {} } = answer ? (typeof answer === 'function' ? answer(call) : answer) : { status: 404, body: { error: { code: 'NOT_FOUND', message: `No fake for ${method} ${url.pathname}` } } };
    return new Response(JSON.stringify(payload), { status, headers: { 'Content-Type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetchStub);
  return { calls, writes: () => calls.filter((c) => c.method !== 'GET') };
}

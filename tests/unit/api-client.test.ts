// The one fetch wrapper: a server failure's message carries the request's reference for the person to quote.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, api } from '../../src/lib/api-client';

afterEach(() => vi.unstubAllGlobals());

function answer(status: number, body: unknown, headers: Record<string, string> = {}) {
  vi.stubGlobal('fetch', vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json', ...headers } })));
}

describe('api client errors', () => {
  it('ends a server failure with the request id the server returned', async () => {
    answer(500, { error: { code: 'INTERNAL', message: 'Something went wrong on the server; nothing was saved' } }, { 'X-Request-Id': 'req-4f2a9c' });
    const error = (await api.get('/api/overview').catch((e: unknown) => e)) as ApiError;
    expect(error).toBeInstanceOf(ApiError);
    expect(error.requestId).toBe('req-4f2a9c');
    expect(error.message).toBe('Something went wrong on the server; nothing was saved (reference req-4f2a9c)');
  });

  it('leaves a message about the input as the server wrote it', async () => {
    answer(400, { error: { code: 'VALIDATION', message: 'Some fields need attention: Title', fields: { title: 'Required' } } }, { 'X-Request-Id': 'req-77' });
    const error = (await api.get('/api/overview').catch((e: unknown) => e)) as ApiError;
    expect(error.message).toBe('Some fields need attention: Title');
    expect(error.requestId).toBe('req-77');
  });
});

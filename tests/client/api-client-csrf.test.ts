// The client half of the CSRF guard: every state-changing request carries X-CSRF-Guard,
// a read does not need it.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { api } from '@/lib/api-client';

afterEach(() => vi.unstubAllGlobals());

function stubFetch() {
  const calls: Array<{ url: string; init: RequestInit }> = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (url: string, init: RequestInit) => {
      calls.push({ url, init });
      return new Response(JSON.stringify({ ok: true }), {
        status: 200,
        headers: { 'Content-Type': 'application/json' },
      });
    }),
  );
  return calls;
}

describe('api client and the CSRF guard', () => {
  it('when the client posts, puts or deletes, then X-CSRF-Guard: 1 is sent; a GET goes without', async () => {
    const calls = stubFetch();
    await api.post('/api/packages', { title: 'x' });
    await api.put('/api/packages/1/draft', { title: 'y' });
    await api.delete('/api/packages/1/files/2');
    await api.get('/api/me');
    const guard = calls.map((c) => (c.init.headers as Record<string, string>)['X-CSRF-Guard']);
    expect(guard).toEqual(['1', '1', '1', undefined]);
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { call, ApiError, routeKey, urlFor } from '@/features/api/client';
import { apiContract } from '@/shared/contract';
import { exampleDesign } from '@/shared/design';

function answer(status: number, body: unknown) {
  const fetch = vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } }));
  vi.stubGlobal('fetch', fetch);
  return fetch;
}

async function failure(promise: Promise<unknown>): Promise<ApiError> {
  const error = await promise.then(
    () => null,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  return error as ApiError;
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('the API client', () => {
  it('keeps an error’s code, message, fields and details', async () => {
    answer(409, {
      error: {
        code: 'version_conflict',
        message: 'Version 2 was saved meanwhile.',
        fields: { baseVersion: 'is stale' },
        details: { latest: { number: 2 } },
      },
    });
    const error = await failure(call(apiContract.notebooks.saveVersion, { params: { id: 'd1' }, body: { baseVersion: 1, params: exampleDesign, message: 'Wider exit slit' } }));
    expect(error).toMatchObject({
      status: 409,
      code: 'version_conflict',
      message: 'Version 2 was saved meanwhile.',
      fields: { baseVersion: 'is stale' },
      details: { latest: { number: 2 } },
    });
  });

  it('leaves details undefined and fields empty when the error has neither', async () => {
    answer(404, { error: { code: 'not_found', message: 'No such design.' } });
    const error = await failure(call(apiContract.notebooks.get, { params: { id: 'nope' } }));
    expect(error).toMatchObject({ status: 404, code: 'not_found', message: 'No such design.', fields: {} });
    expect(error.details).toBeUndefined();
  });

  it('calls an error answer that is not the error shape unexpected', async () => {
    answer(502, { error: { code: 'bad_gateway', message: 'Upstream.', details: 'not an object' } });
    const error = await failure(call(apiContract.platform.health, {}));
    expect(error).toMatchObject({ status: 502, code: 'unexpected' });
  });

  it('takes the method and path from the contract, encodes path parameters and skips empty query values', async () => {
    const fetch = answer(200, { messages: [] });
    await call(apiContract.platform.outbox, {});
    expect(fetch).toHaveBeenCalledWith('/api/dev/outbox', expect.objectContaining({ method: 'GET' }));
    expect(urlFor(apiContract.notebooks.version, { params: { id: 'a/b c', n: 3 } })).toBe('/api/designs/a%2Fb%20c/versions/3');
    expect(urlFor(apiContract.notebooks.list, { params: { teamId: 't1' }, query: { q: 'ebert', tag: '', page: 2, sort: undefined } })).toBe(
      '/api/teams/t1/designs?q=ebert&page=2',
    );
  });

  it('refuses to call a route without one of its path parameters', () => {
    expect(() => urlFor(apiContract.teams.members, { params: { teamId: '' } })).toThrow(/teams\.members needs the path parameter teamId/);
  });

  it('sends the body as JSON with the contract’s method', async () => {
    const fetch = answer(201, { team: { id: 't1', name: 'Optics bench', role: 'owner', personal: false, createdAt: '2026-01-05T10:00:00.000Z', memberCount: 1 } });
    await call(apiContract.teams.create, { body: { name: 'Optics bench' } }).catch(() => undefined);
    expect(fetch).toHaveBeenCalledWith('/api/teams', expect.objectContaining({ method: 'POST', body: JSON.stringify({ name: 'Optics bench' }) }));
  });

  it('answers a 204 with undefined, without reading a body', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response(null, { status: 204 })));
    await expect(call(apiContract.accounts.signOut, {})).resolves.toBeUndefined();
  });

  it('calls an answer that does not match the contract’s schema bad_response, naming the route', async () => {
    answer(200, { status: 'fine' });
    const error = await failure(call(apiContract.platform.health, {}));
    expect(error).toMatchObject({ code: 'bad_response', message: expect.stringContaining('platform.health') });
  });

  it('derives query keys from the route’s name, so no screen spells one', () => {
    expect(routeKey(apiContract.notebooks.get, { params: { id: 'd1' } })).toEqual(['notebooks', 'get', { params: { id: 'd1' } }]);
    expect(routeKey(apiContract.notebooks.list)).toEqual(['notebooks', 'list']);
  });
});

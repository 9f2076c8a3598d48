import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { api, ApiError } from '@/features/api/client';

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
    const error = await failure(api('/designs/d1/versions', z.unknown(), { method: 'POST', body: {} }));
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
    const error = await failure(api('/designs/nope', z.unknown()));
    expect(error).toMatchObject({ status: 404, code: 'not_found', message: 'No such design.', fields: {} });
    expect(error.details).toBeUndefined();
  });

  it('calls an error answer that is not the error shape unexpected', async () => {
    answer(502, { error: { code: 'bad_gateway', message: 'Upstream.', details: 'not an object' } });
    const error = await failure(api('/health', z.unknown()));
    expect(error).toMatchObject({ status: 502, code: 'unexpected' });
  });
});

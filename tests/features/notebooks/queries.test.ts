import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/features/api/client';
import { saveVersion, VersionConflict } from '@/features/notebooks/queries';
import { exampleDesign } from '@/shared/design';
import type { Version } from '@/shared/notebooks';

const latest: Version = {
  number: 2,
  message: 'Colleague’s change',
  author: { id: 'u2', displayName: 'Maren Okafor-Lind' },
  createdAt: '2026-03-01T10:00:00.000Z',
  parentNumber: 1,
  summary: {
    rangeStartNm: 400,
    rangeEndNm: 700,
    centreWavelengthNm: 550,
    centreReachable: true,
    bandpassAtCentreNm: 1,
    resolvingPowerAtCentre: 1000,
    reciprocalDispersionAtCentreNmPerMm: 2,
    fNumber: 4,
    warningCount: 0,
  },
  params: exampleDesign,
  notes: '',
};

function answer(status: number, body: unknown) {
  const fetch = vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } }));
  vi.stubGlobal('fetch', fetch);
  return fetch;
}

const save = () => saveVersion('d1', { baseVersion: 1, params: exampleDesign, message: 'My change' });

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('saving a version', () => {
  it('turns a stale save’s 409 into a VersionConflict holding the latest from the answer, with no second request', async () => {
    const fetch = answer(409, { error: { code: 'version_conflict', message: 'Version 2 was saved meanwhile.', details: { latest } } });
    const error = await save().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(VersionConflict);
    expect((error as VersionConflict).latest).toEqual(latest);
    expect(fetch).toHaveBeenCalledTimes(1);
  });

  it('refuses a conflict whose details do not match the shared schema', async () => {
    answer(409, { error: { code: 'version_conflict', message: 'Version 2 was saved meanwhile.', details: { latest: { number: 2 } } } });
    const error = await save().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 409, code: 'bad_response' });
  });

  it('passes any other 409 on as it came', async () => {
    answer(409, { error: { code: 'conflict', message: 'This design is archived.' } });
    const error = await save().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 409, code: 'conflict', message: 'This design is archived.' });
  });
});

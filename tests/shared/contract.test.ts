import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiContract, apiRoutes, expressPath, routeName } from '@/shared/contract';

describe('the API contract', () => {
  it('names every route once and gives each method and path to one route only', () => {
    const names = apiRoutes.map((entry) => entry.name);
    expect(new Set(names).size).toBe(names.length);
    const endpoints = apiRoutes.map((entry) => `${entry.method} ${entry.path}`);
    expect(new Set(endpoints).size).toBe(endpoints.length);
    expect(routeName(apiContract.notebooks.saveVersion)).toBe('notebooks.saveVersion');
  });

  it.each(apiRoutes.map((entry) => [entry.name, entry] as const))('%s: path parameters match its params schema', (_name, entry) => {
    const inPath = [...entry.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]).sort();
    const params = entry.parts.params as z.ZodObject | undefined;
    expect(Object.keys(params?.shape ?? {}).sort()).toEqual(inPath);
  });

  it.each(apiRoutes.map((entry) => [entry.name, entry] as const))('%s: an answer schema unless it answers 204 or a file, and a capability for team routes', (_name, entry) => {
    expect(entry.output === undefined).toBe(entry.status === 204 || entry.meta.file !== undefined);
    // A file answers with a body: never a 204.
    if (entry.meta.file) expect(entry.status).toBe(200);
    if (entry.meta.access.kind === 'team') expect(entry.meta.access.capability).toMatch(/^\w+\.\w+$/);
    // A GET carries no body; the Origin check may only be skipped by a route that reads no session.
    if (entry.method === 'GET') expect(entry.parts.body).toBeUndefined();
    if (entry.meta.originExempt) expect(entry.meta.access.kind).toBe('anyone');
  });

  it('spells paths for Express with colons', () => {
    expect(expressPath('/designs/{id}/versions/{n}')).toBe('/designs/:id/versions/:n');
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/features/api/client';
import { fetchSheet, sheetFallbackName, sheetLabel, type SheetTarget } from '@/features/sheets/sheet-target';

const title = 'Sodium doublet monochromator';
const version: SheetTarget = { kind: 'version', designId: 'd1', version: 3, title };
const compare: SheetTarget = { kind: 'compare', designId: 'd1', a: 1, b: 2, title };
const shared: SheetTarget = { kind: 'shared', token: 'tok_abc', version: 2, title };

/** Answers every fetch with `response` and records what was asked. */
function answer(response: () => Response) {
  const fetch = vi.fn(async (_url: string, _init?: RequestInit) => response());
  vi.stubGlobal('fetch', fetch);
  return fetch;
}

const pdf = (headers: Record<string, string> = {}) => () =>
  new Response(new TextEncoder().encode('%PDF-1.7\n'), { status: 200, headers: { 'content-type': 'application/pdf', ...headers } });

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('design sheet requests', () => {
  it.each([
    { target: version, paper: 'letter', url: '/api/designs/d1/versions/3/sheet.pdf?paper=letter' },
    { target: compare, paper: 'a4', url: '/api/designs/d1/compare.pdf?a=1&b=2&paper=a4' },
    { target: shared, paper: 'a4', url: '/api/share/tok_abc/sheet.pdf?paper=a4' },
  ] as const)('asks $url for a $target.kind sheet', async ({ target, paper, url }) => {
    const fetch = answer(pdf());
    await fetchSheet(target, paper);
    expect(fetch).toHaveBeenCalledTimes(1);
    expect(fetch.mock.calls[0]?.[0]).toBe(url);
    expect(fetch.mock.calls[0]?.[1]).toMatchObject({ method: 'GET', credentials: 'same-origin' });
  });

  it('saves under the name the server gives, with the bytes whole', async () => {
    answer(pdf({ 'content-disposition': 'attachment; filename="from-the-server-v3.pdf"' }));
    const file = await fetchSheet(version, 'a4');
    expect(file.fileName).toBe('from-the-server-v3.pdf');
    expect(await file.blob.text()).toBe('%PDF-1.7\n');
  });

  // The names issue 14 asks for: `<design>-v<n>.pdf`, and both numbers for a comparison.
  it.each([
    { target: version, name: 'sodium-doublet-monochromator-v3.pdf' },
    { target: compare, name: 'sodium-doublet-monochromator-v1-vs-v2.pdf' },
    { target: shared, name: 'sodium-doublet-monochromator-v2.pdf' },
  ] as const)('falls back to $name when the answer names no file', async ({ target, name }) => {
    answer(pdf());
    expect((await fetchSheet(target, 'a4')).fileName).toBe(name);
    expect(sheetFallbackName(target)).toBe(name);
  });

  it('hands on the server’s message when the sheet fails', async () => {
    answer(
      () =>
        new Response(JSON.stringify({ error: { code: 'internal', message: 'The sheet could not be drawn.' } }), {
          status: 500,
          headers: { 'content-type': 'application/json' },
        }),
    );
    const error = await fetchSheet(version, 'a4').then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 500, message: 'The sheet could not be drawn.' });
  });

  it('names the button for what it prints', () => {
    expect(sheetLabel(version)).toBe('Design sheet (PDF)');
    expect(sheetLabel(shared)).toBe('Design sheet (PDF)');
    expect(sheetLabel(compare)).toBe('Compare sheet (PDF)');
  });
});

import { describe, expect, it } from 'vitest';
import { readPaper, rememberPaper, SHEET_PAPER_KEY } from '@/features/sheets/paper-choice';
import { withFakeLocalStorage } from '../../support/fake-local-storage';

const local = withFakeLocalStorage();

describe('the paper a sheet is printed on', () => {
  it('is A4 until someone picks another', () => {
    expect(readPaper()).toBe('a4');
  });

  it('is remembered once picked', () => {
    rememberPaper('letter');
    expect(readPaper()).toBe('letter');
    rememberPaper('a4');
    expect(readPaper()).toBe('a4');
  });

  it('falls back to A4 when what is kept is no paper size', () => {
    local.items.set(SHEET_PAPER_KEY, JSON.stringify({ version: 1, value: 'tabloid' }));
    expect(readPaper()).toBe('a4');
    expect(local.items.has(SHEET_PAPER_KEY)).toBe(false);
  });
});

import { z } from 'zod';
import { PAPER_SIZES, type Paper } from '@/shared/sheets';
import { persistedState } from '@/features/ui/persisted-state';

/** The paper last chosen for a sheet, kept on this device for every design. */
export const SHEET_PAPER_KEY = 'blazebook.sheet-paper';
const store = persistedState({ version: 1, schema: z.enum(PAPER_SIZES) });

/** A4 until someone picks US Letter: most of the world's paper, and the server's default too. */
export function readPaper(): Paper {
  return store.read(SHEET_PAPER_KEY) ?? 'a4';
}

export function rememberPaper(paper: Paper): void {
  store.write(SHEET_PAPER_KEY, paper);
}

import { z } from 'zod';
import { plainFileBase } from './export-file-name';
import { versionNumberText } from './notebooks/version-number';

/**
 * The design sheet: a PDF of one version (or of two, side by side) for managers, the build shop
 * and review meetings. The server draws it; these are the request parts both sides read.
 */

export const PAPER_SIZES = ['a4', 'letter'] as const;
export type Paper = (typeof PAPER_SIZES)[number];
export const paperLabels: Record<Paper, string> = { a4: 'A4', letter: 'US Letter' };

/** At most this many extra wavelengths in the performance table (`?at=`). */
export const MAX_SHEET_WAVELENGTHS = 8;

/** The same bounds as a design's wavelengths (shared/design.ts). */
const WAVELENGTH_MIN_NM = 0.001;
const WAVELENGTH_MAX_NM = 10_000_000;

const paper = z.enum(PAPER_SIZES, { error: 'must be a4 or letter' }).default('a4');

/** `?at=404.7,546.1`: wavelengths in nm the performance table lists besides start, centre and end. */
const atWavelengths = z
  .string()
  .max(200, { error: 'must be at most 200 characters' })
  .transform((text, ctx) => {
    const parts = text.split(',').map((part) => part.trim()).filter((part) => part !== '');
    if (parts.length > MAX_SHEET_WAVELENGTHS) {
      ctx.addIssue({ code: 'custom', message: `must list at most ${MAX_SHEET_WAVELENGTHS} wavelengths` });
      return z.NEVER;
    }
    const values = parts.map(Number);
    if (values.some((v) => !Number.isFinite(v) || v < WAVELENGTH_MIN_NM || v > WAVELENGTH_MAX_NM)) {
      ctx.addIssue({
        code: 'custom',
        message: `must be wavelengths in nm between ${WAVELENGTH_MIN_NM} and ${WAVELENGTH_MAX_NM}, separated by commas`,
      });
      return z.NEVER;
    }
    return [...new Set(values)].sort((x, y) => x - y);
  });

export const sheetQuerySchema = z.object({ paper, at: atWavelengths.optional() });
export type SheetQuery = z.output<typeof sheetQuerySchema>;

export const compareSheetQuerySchema = z.object({ a: versionNumberText, b: versionNumberText, paper });
export type CompareSheetQuery = z.output<typeof compareSheetQuerySchema>;

const fileBase = (title: string) => plainFileBase(title, 'design');

/** `<design>-v<n>.pdf`, the name the download is saved under. */
export function sheetFileName(title: string, version: number): string {
  return `${fileBase(title)}-v${version}.pdf`;
}

/** `<design>-v<a>-vs-v<b>.pdf` for the compare sheet. */
export function compareSheetFileName(title: string, a: number, b: number): string {
  return `${fileBase(title)}-v${a}-vs-v${b}.pdf`;
}

import { apiContract } from '@/shared/contract';
import { compareSheetFileName, sheetFileName, type Paper } from '@/shared/sheets';
import { fetchFile } from '@/features/api';

/** What a sheet button prints: one version (a member's or a share link's), or two compared. */
export type SheetTarget =
  | { kind: 'version'; designId: string; version: number; title: string }
  | { kind: 'compare'; designId: string; a: number; b: number; title: string }
  | { kind: 'shared'; token: string; version: number; title: string };

/** The button's name, which is also its accessible name. */
export function sheetLabel(target: SheetTarget): string {
  return target.kind === 'compare' ? 'Compare sheet (PDF)' : 'Design sheet (PDF)';
}

/** The name a sheet is saved under when the answer carries none (the server's is the same rule). */
export function sheetFallbackName(target: SheetTarget): string {
  return target.kind === 'compare'
    ? compareSheetFileName(target.title, target.a, target.b)
    : sheetFileName(target.title, target.version);
}

/** A finished sheet: its bytes and the name to save them under. */
export type SheetFile = { blob: Blob; fileName: string };

/** Asks the server for the sheet on `paper` through the route the target needs. */
export async function fetchSheet(target: SheetTarget, paper: Paper, options: { signal?: AbortSignal } = {}): Promise<SheetFile> {
  const { sheets } = apiContract;
  const file =
    target.kind === 'version'
      ? await fetchFile(sheets.version, { params: { id: target.designId, n: target.version }, query: { paper } }, options)
      : target.kind === 'compare'
        ? await fetchFile(sheets.compare, { params: { id: target.designId }, query: { a: target.a, b: target.b, paper } }, options)
        : await fetchFile(sheets.shared, { params: { token: target.token }, query: { paper } }, options);
  return { blob: file.blob, fileName: file.fileName ?? sheetFallbackName(target) };
}

import { downloadBlob } from '@/features/ui';

/**
 * Web (and default): the browser saves the sheet as a download under its file name. Answers what
 * to tell the person afterwards.
 */
export async function downloadSheet(blob: Blob, fileName: string): Promise<string | null> {
  downloadBlob(blob, fileName);
  return `Downloaded ${fileName}.`;
}

/** Why this device cannot take a sheet, or null when it can (a browser always can). */
export async function sheetDownloadUnavailable(): Promise<string | null> {
  return null;
}

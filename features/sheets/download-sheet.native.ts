import { File, Paths } from 'expo-file-system';
import { isAvailableAsync, shareAsync } from 'expo-sharing';

/** React Native's Blob has no arrayBuffer(); its FileReader reads one. */
function blobBytes(blob: Blob): Promise<Uint8Array> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(new Uint8Array(reader.result as ArrayBuffer));
    reader.onerror = () => reject(new Error('The design sheet could not be read.'));
    reader.readAsArrayBuffer(blob);
  });
}

/**
 * Native: the share sheet only hands on files that exist, so the sheet is written to the cache
 * directory first (replacing an earlier copy of the same name) and offered from there.
 */
export async function downloadSheet(blob: Blob, fileName: string): Promise<string | null> {
  const file = new File(Paths.cache, fileName);
  if (file.exists) file.delete();
  file.create();
  file.write(await blobBytes(blob));
  await shareAsync(file.uri, { mimeType: 'application/pdf', UTI: 'com.adobe.pdf', dialogTitle: fileName });
  // The share sheet does not say whether the file went anywhere, so there is nothing to report.
  return null;
}

/** Why this device cannot take a sheet, or null when it can. */
export async function sheetDownloadUnavailable(): Promise<string | null> {
  return (await isAvailableAsync())
    ? null
    : 'This device offers no way to share files, so the design sheet cannot be handed to another app.';
}

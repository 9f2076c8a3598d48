import { Share } from 'react-native';

/**
 * Native: share the file's text through the share sheet. A real file on disk needs
 * expo-file-system (expo-sharing only shares files that exist), which is not a declared dependency.
 */
export async function saveTextFile(text: string, fileName: string, _mimeType?: string): Promise<boolean> {
  const result = await Share.share({ message: text, title: fileName });
  return result.action === Share.sharedAction;
}

/** Native has no browser download: files go to the share sheet (see features/sheets). */
export function downloadBlob(_blob: Blob, _fileName: string): void {
  throw new Error('A download needs a browser; on this device files go to the share sheet.');
}

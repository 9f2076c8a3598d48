import { Share } from 'react-native';

/**
 * Native: share the file's text through the share sheet. A real file on disk would need
 * expo-file-system as a declared dependency of the app, which it is not yet.
 */
export async function saveTextFile(text: string, fileName: string): Promise<boolean> {
  const result = await Share.share({ message: text, title: fileName });
  return result.action === Share.sharedAction;
}

/** Native has no page origin; links are shown as paths on the server the app talks to. */
export function absoluteUrl(path: string): string {
  return path;
}

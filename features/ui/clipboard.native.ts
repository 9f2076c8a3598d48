import { Share } from 'react-native';

/** Native: hand the text to the share sheet (no clipboard module is bundled). */
export async function copyText(text: string): Promise<boolean> {
  const result = await Share.share({ message: text });
  return result.action === Share.sharedAction;
}

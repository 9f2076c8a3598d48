import { Share } from 'react-native';

/**
 * Native: share the document's text through the share sheet. Writing a real `.svg` file needs
 * expo-file-system (expo-sharing only shares files that exist), which is not a declared dependency.
 */
export async function saveSvgFile(svg: string, fileName: string): Promise<boolean> {
  const result = await Share.share({ message: svg, title: fileName });
  return result.action === Share.sharedAction;
}

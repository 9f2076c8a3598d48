import type { NotebookFileInput } from '@/shared/notebooks';
import { Text } from '@/features/ui';

type Props = { onImport: (file: NotebookFileInput) => Promise<unknown>; busy: boolean };

/**
 * Native: picking a file needs expo-document-picker, which is not a dependency yet; importing is
 * offered in the web app meanwhile.
 */
export function ImportButton(_props: Props) {
  return (
    <Text variant="small" tone="muted">
      Importing a notebook file works in the web app.
    </Text>
  );
}

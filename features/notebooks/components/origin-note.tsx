import type { Notebook } from '@/shared/notebooks';
import { Text } from '@/features/ui';
import { importedOriginText } from '../notices';

/**
 * "Imported from a file on 14 Mar 2026" under a notebook's title, so a design that arrived as a
 * file is not mistaken for the one it was exported from (both keep the same title). Nothing for a
 * design made here.
 */
export function OriginNote({ design }: { design: Pick<Notebook, 'importedAt'> }) {
  if (!design.importedAt) return null;
  return (
    <Text variant="small" tone="muted" testID="import-origin">
      {importedOriginText(design.importedAt)}
    </Text>
  );
}

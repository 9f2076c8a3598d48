import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Notebook } from '@/shared/notebooks';
import { Text, space } from '@/features/ui';
import { useUpdateDesignMutation } from '../queries';
import { DesignRow, columnStyle, tableRowStyle } from './design-row';
import { DesignRowEditor } from './design-row-editor';

type Props = {
  /** Undefined until the first page has loaded. */
  designs: Notebook[] | undefined;
  wide: boolean;
  owner: boolean;
  /** What to say when the page is empty. */
  emptyText: string;
  error: string | null;
  loading: boolean;
};

/** The team's designs as a table (a header row on wide screens), one row open for editing at a time. */
export function DesignTable({ designs, wide, owner, emptyText, error, loading }: Props) {
  const update = useUpdateDesignMutation();
  const [editing, setEditing] = useState<string | null>(null);
  return (
    <View role="table" aria-label="Designs" testID="design-table">
      {wide ? (
        <View role="row" style={[tableRowStyle, styles.headerRow]}>
          {['Title', 'Owner', 'Updated', 'Latest', ''].map((title, i) => (
            <Text
              key={title || 'actions'}
              role="columnheader"
              variant="caption"
              tone="muted"
              weight="semibold"
              style={columnStyle[i]}
            >
              {title.toUpperCase()}
            </Text>
          ))}
        </View>
      ) : null}
      {designs?.map((design) =>
        editing === design.id ? (
          <DesignRowEditor key={design.id} design={design} onDone={() => setEditing(null)} />
        ) : (
          <DesignRow
            key={design.id}
            design={design}
            wide={wide}
            owner={owner}
            onEdit={() => setEditing(design.id)}
            onArchive={() => update.mutate({ id: design.id, body: { archived: !design.archived } })}
            archiving={update.isPending}
          />
        ),
      )}
      {designs && designs.length === 0 ? (
        <Text tone="muted" style={styles.empty} testID="no-designs">
          {emptyText}
        </Text>
      ) : null}
      {error !== null ? (
        <Text role="alert" tone="danger">
          {error}
        </Text>
      ) : null}
      {!designs && loading ? <Text tone="muted">Loading designs…</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  headerRow: { borderBottomWidth: 2 },
  empty: { paddingVertical: space.md },
});

import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Notebook } from '@/shared/notebooks';
import { Button, Text, colors, radius, space } from '@/features/ui';
import { focusButton } from '../hooks/focus-button';
import { archiveNoticeText, type ArchiveNotice } from '../notices';
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
  const [notice, setNotice] = useState<ArchiveNotice | null>(null);
  const noticeBox = useRef<View>(null);

  const setArchived = (design: Pick<Notebook, 'id' | 'title'>, archived: boolean) =>
    update.mutate(
      { id: design.id, body: { archived } },
      {
        onSuccess: () =>
          setNotice({ kind: archived ? 'archived' : 'restored', id: design.id, title: design.title }),
        onError: (error) => setNotice({ kind: 'failed', title: design.title, reason: error.message }),
      },
    );

  // The row whose button had focus has left the list: focus goes to the way back.
  useEffect(() => {
    if (notice?.kind === 'archived') focusButton(noticeBox.current, 'Undo');
  }, [notice]);

  // The notice and the empty, error and loading lines sit outside the table: a table holds rows only.
  return (
    <View testID="design-table">
      <View
        ref={noticeBox}
        role="status"
        accessibilityLiveRegion="polite"
        style={notice ? [styles.notice, notice.kind === 'failed' && styles.noticeFailed] : null}
        testID="archive-status"
      >
        {notice ? (
          <>
            <Text tone={notice.kind === 'failed' ? 'danger' : 'default'} style={styles.noticeText}>
              {archiveNoticeText(notice)}
            </Text>
            {notice.kind === 'archived' ? (
              <Button
                kind="secondary"
                label="Undo"
                onPress={() => setArchived(notice, false)}
                disabled={update.isPending}
                testID="undo-archive"
              />
            ) : null}
          </>
        ) : null}
      </View>
      {designs && designs.length > 0 ? (
        <View role="table" aria-label="Designs">
          {wide ? (
            <View role="row" style={[tableRowStyle, styles.headerRow]}>
              {['Title', 'Owner', 'Updated', 'Latest and review', ''].map((title, i) => (
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
              <View key={design.id} role="row">
                <View role="cell">
                  <DesignRowEditor design={design} onDone={() => setEditing(null)} />
                </View>
              </View>
            ) : (
              <DesignRow
                key={design.id}
                design={design}
                wide={wide}
                owner={owner}
                onEdit={() => setEditing(design.id)}
                onArchive={() => setArchived(design, !design.archived)}
                archiving={update.isPending}
              />
            ),
          )}
        </View>
      ) : null}
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
  notice: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: space.sm,
    padding: space.sm,
    marginBottom: space.sm,
    borderRadius: radius.md,
    backgroundColor: colors.okSoft,
  },
  noticeFailed: { backgroundColor: colors.surfaceSunken },
  noticeText: { flexShrink: 1 },
  headerRow: { borderBottomWidth: 2 },
  empty: { paddingVertical: space.md },
});

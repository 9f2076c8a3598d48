import { StyleSheet, View } from 'react-native';
import { Button, Text, space } from '@/features/ui';

type Props = {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
};

/** "21–40 of 57" with Previous and Next; nothing for an empty list. */
export function ListPaging({ page, pageSize, total, onPage }: Props) {
  if (total <= 0) return null;
  const first = (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <View style={styles.paging}>
      <Text variant="small" tone="muted" testID="page-info">
        {first}–{last} of {total}
      </Text>
      <View style={styles.row}>
        <Button
          kind="secondary"
          label="Previous"
          onPress={() => onPage(Math.max(1, page - 1))}
          disabled={page <= 1}
          testID="page-previous"
        />
        <Button
          kind="secondary"
          label="Next"
          onPress={() => onPage(page + 1)}
          disabled={last >= total}
          testID="page-next"
        />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  paging: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    alignItems: 'center',
    gap: space.sm,
    paddingTop: space.sm,
  },
});

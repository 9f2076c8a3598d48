import { StyleSheet, View } from 'react-native';
import type { DesignSort } from '@/shared/notebooks';
import { reviewStateLabels, reviewStates, type ReviewState } from '@/shared/reviews';
import { TextField, space } from '@/features/ui';
import { useSearchText } from '../hooks/use-search-text';
import type { ListView } from '../list-view';
import { ChoiceChips } from './choice-chips';

const sorts: { value: DesignSort; label: string }[] = [
  { value: 'updated', label: 'Updated' },
  { value: 'title', label: 'Title' },
  { value: 'owner', label: 'Owner' },
];

type Props = {
  view: ListView;
  onChange: (change: Partial<ListView>) => void;
  /** Every tag used in the team; the tag chips show only when there is one. */
  tags: string[];
  wide: boolean;
};

const reviewOptions: { value: ReviewState | ''; label: string }[] = [
  { value: '', label: 'All' },
  ...reviewStates.map((state) => ({ value: state, label: reviewStateLabels[state] })),
];

/** Search, sort, order, live or archived, review state and tag: the design list's view. */
export function DesignListFilters({ view, onChange, tags, wide }: Props) {
  const [search, setSearch] = useSearchText(view.q, (q) => onChange({ q }));
  const { sort } = view;
  const dir = view.dir ?? (sort === 'updated' ? 'desc' : 'asc');
  return (
    <>
      <TextField
        label="Search titles"
        value={search}
        onChangeText={setSearch}
        placeholder="e.g. sodium"
        testID="search"
      />
      <View style={[styles.filters, wide && styles.filtersWide]}>
        <ChoiceChips
          label="Sort by"
          options={sorts}
          value={sort}
          onChange={(s) => onChange({ sort: s })}
          testID="sort"
        />
        <ChoiceChips
          label="Order"
          options={[
            { value: 'asc', label: sort === 'updated' ? 'Oldest first' : 'A → Z' },
            { value: 'desc', label: sort === 'updated' ? 'Newest first' : 'Z → A' },
          ]}
          value={dir}
          onChange={(d) => onChange({ dir: d })}
          testID="dir"
        />
        <ChoiceChips
          label="Show"
          options={[
            { value: 'exclude', label: 'Live' },
            { value: 'only', label: 'Archived' },
          ]}
          value={view.archived}
          onChange={(archived) => onChange({ archived })}
          testID="archived"
        />
      </View>
      <ChoiceChips
        label="Review state"
        options={reviewOptions}
        value={view.review ?? ''}
        onChange={(state) => onChange({ review: state || undefined })}
        testID="review-filter"
      />
      {tags.length > 0 ? (
        <ChoiceChips
          label="Tag"
          options={[{ value: '', label: 'All tags' }, ...tags.map((t) => ({ value: t, label: t }))]}
          value={view.tag ?? ''}
          onChange={(t) => onChange({ tag: t || undefined })}
          testID="tag-filter"
        />
      ) : null}
    </>
  );
}

const styles = StyleSheet.create({
  filters: { gap: space.md },
  filtersWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl },
});

import { Redirect, useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useEffect, useState } from 'react';
import { Pressable, StyleSheet, View, type TextStyle } from 'react-native';
import { tagsSchema, type DesignSort, type ListDesignsQuery, type Notebook } from '@/shared/notebooks';
import { can } from '@/shared/teams';
import { TeamSwitcher, useTeamsQuery } from '@/features/teams';
import {
  Button,
  Card,
  Heading,
  Screen,
  Text,
  TextField,
  colors,
  fonts,
  space,
  useLayout,
} from '@/features/ui';
import { formatDay } from '../format';
import { useDesignListQuery, useImportMutation, useUpdateDesignMutation } from '../queries';
import { ChoiceChips } from './choice-chips';
import { CreateNotebookCard } from './create-notebook-card';
import { Badge } from './history-table';
import { ImportButton } from './import-button';

const pageSize = 20;
const sorts: { value: DesignSort; label: string }[] = [
  { value: 'updated', label: 'Updated' },
  { value: 'title', label: 'Title' },
  { value: 'owner', label: 'Owner' },
];
const columnStyle: TextStyle[] = [
  { flex: 3, minWidth: 0 },
  { flex: 1.2, minWidth: 0 },
  { width: 110 },
  { width: 70 },
  { width: 250 },
];

/** `/notebooks`: the designs of the user's first shared team, else of their personal workspace. */
export function NotebooksHomeScreen() {
  const teams = useTeamsQuery();
  if (!teams.data) {
    return (
      <Screen>
        <Text tone="muted">{teams.isError ? teams.error.message : 'Loading your teams…'}</Text>
      </Screen>
    );
  }
  const team = teams.data.find((t) => !t.personal) ?? teams.data[0];
  if (!team) return null;
  return <Redirect href={`/teams/${team.id}/notebooks` as Href} />;
}

function useDebounced<T>(value: T, ms: number): T {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return debounced;
}

function RowEditor({ design, onDone }: { design: Notebook; onDone: () => void }) {
  const update = useUpdateDesignMutation();
  const [title, setTitle] = useState(design.title);
  const [tags, setTags] = useState(design.tags.join(', '));
  const [error, setError] = useState<string | null>(null);
  const save = async () => {
    const parsedTags = tagsSchema.safeParse(
      tags
        .split(',')
        .map((t) => t.trim())
        .filter(Boolean),
    );
    if (!parsedTags.success) {
      setError(`Tags ${parsedTags.error.issues[0]?.message ?? 'are not valid'}`);
      return;
    }
    try {
      await update.mutateAsync({ id: design.id, body: { title, tags: parsedTags.data } });
      onDone();
    } catch (failure) {
      setError(failure instanceof Error ? failure.message : 'That did not work.');
    }
  };
  return (
    <View style={styles.editor} testID={`edit-${design.id}`}>
      <TextField label="Title" value={title} onChangeText={setTitle} maxLength={120} testID="edit-title" />
      <TextField
        label="Tags, separated by commas"
        value={tags}
        onChangeText={setTags}
        placeholder="uv, teaching"
        testID="edit-tags"
      />
      {error ? (
        <Text role="alert" tone="danger">
          {error}
        </Text>
      ) : null}
      <View style={styles.row}>
        <Button label="Save" onPress={() => void save()} disabled={update.isPending} testID="edit-save" />
        <Button kind="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

/** `/teams/:teamId/notebooks`: the team's designs with search, tag filter, sort and pages. */
export function NotebookListScreen() {
  const { teamId = '' } = useLocalSearchParams<{ teamId: string }>();
  const router = useRouter();
  const layout = useLayout();
  const wide = layout !== 'phone';
  const teams = useTeamsQuery();
  const team = teams.data?.find((t) => t.id === teamId);
  const owner = can(team?.role, 'designs.edit');
  const [search, setSearch] = useState('');
  const [tag, setTag] = useState<string | undefined>(undefined);
  const [sort, setSort] = useState<DesignSort>('updated');
  const [dir, setDir] = useState<'asc' | 'desc' | undefined>(undefined);
  const [archived, setArchived] = useState<'exclude' | 'only'>('exclude');
  const [page, setPage] = useState(1);
  const [editing, setEditing] = useState<string | null>(null);
  const [creating, setCreating] = useState(false);
  const q = useDebounced(search.trim(), 250);
  /** Any change of filter or order starts again at page 1. */
  const firstPage =
    <T,>(set: (value: T) => void) =>
    (value: T) => {
      set(value);
      setPage(1);
    };
  const query: ListDesignsQuery = { q: q || undefined, tag, sort, dir, page, pageSize, archived };
  const list = useDesignListQuery(teamId, query);
  const update = useUpdateDesignMutation();
  const importFile = useImportMutation(teamId);

  if (teams.data && !team) {
    return (
      <Screen>
        <Heading level={1}>No such team</Heading>
        <Text tone="muted">It does not exist, or you are not in it.</Text>
      </Screen>
    );
  }

  const data = list.data;
  const first = data && data.total > 0 ? (data.page - 1) * data.pageSize + 1 : 0;
  const last = data ? Math.min(data.total, data.page * data.pageSize) : 0;
  const effectiveDir = dir ?? (sort === 'updated' ? 'desc' : 'asc');

  const rowActions = (design: Notebook) =>
    owner ? (
      <View style={styles.rowActions}>
        <Button
          kind="quiet"
          label="Rename / tag"
          accessibilityLabel={`Rename or tag ${design.title}`}
          onPress={() => setEditing(design.id)}
          testID={`rename-${design.id}`}
        />
        <Button
          kind="quiet"
          label={design.archived ? 'Restore' : 'Archive'}
          accessibilityLabel={`${design.archived ? 'Restore' : 'Archive'} ${design.title}`}
          onPress={() => update.mutate({ id: design.id, body: { archived: !design.archived } })}
          disabled={update.isPending}
          testID={`archive-${design.id}`}
        />
      </View>
    ) : null;

  const titleCell = (design: Notebook) => (
    <View style={styles.titleCell}>
      <Pressable
        role="link"
        onPress={() => router.push(`/notebooks/${design.id}` as Href)}
        testID={`open-${design.title}`}
      >
        <Text weight="semibold" style={styles.link}>
          {design.title}
        </Text>
      </Pressable>
      <View style={styles.marks}>
        {design.baselineVersion !== null ? (
          <Badge label={`Baseline v${design.baselineVersion}`} tone="accent" />
        ) : null}
        {design.tags.map((t) => (
          <Badge key={t} label={t} tone="primary" />
        ))}
      </View>
      {design.clonedFrom ? (
        <Text variant="caption" tone="muted">
          from {design.clonedFrom.title} v{design.clonedFrom.version}
        </Text>
      ) : null}
    </View>
  );

  return (
    <Screen wide style={styles.page}>
      <TeamSwitcher currentTeamId={teamId} section="notebooks" testID="notebook-team-tabs" />
      <View style={styles.heading}>
        <Heading level={1} testID="list-heading">
          Designs{team ? ` of ${team.personal ? 'your personal workspace' : team.name}` : ''}
        </Heading>
        <Text tone="muted">
          {owner
            ? 'Baselines come first: they are where colleagues start.'
            : 'Baselines come first. You can open, compare and clone every design here.'}
        </Text>
        {owner && !creating ? (
          <View style={styles.row}>
            <Button label="New design" onPress={() => setCreating(true)} testID="show-create" />
          </View>
        ) : null}
      </View>

      {owner && creating ? <CreateNotebookCard teamId={teamId} onCancel={() => setCreating(false)} /> : null}

      <Card>
        <TextField
          label="Search titles"
          value={search}
          onChangeText={firstPage(setSearch)}
          placeholder="e.g. sodium"
          testID="search"
        />
        <View style={[styles.filters, wide && styles.filtersWide]}>
          <ChoiceChips
            label="Sort by"
            options={sorts}
            value={sort}
            onChange={firstPage((s: DesignSort) => (setSort(s), setDir(undefined)))}
            testID="sort"
          />
          <ChoiceChips
            label="Order"
            options={[
              { value: 'asc', label: sort === 'updated' ? 'Oldest first' : 'A → Z' },
              { value: 'desc', label: sort === 'updated' ? 'Newest first' : 'Z → A' },
            ]}
            value={effectiveDir}
            onChange={firstPage(setDir)}
            testID="dir"
          />
          <ChoiceChips
            label="Show"
            options={[
              { value: 'exclude', label: 'Live' },
              { value: 'only', label: 'Archived' },
            ]}
            value={archived}
            onChange={firstPage(setArchived)}
            testID="archived"
          />
        </View>
        {data && data.tags.length > 0 ? (
          <ChoiceChips
            label="Tag"
            options={[{ value: '', label: 'All tags' }, ...data.tags.map((t) => ({ value: t, label: t }))]}
            value={tag ?? ''}
            onChange={firstPage((t: string) => setTag(t || undefined))}
            testID="tag-filter"
          />
        ) : null}
      </Card>

      <Card>
        <View role="table" aria-label="Designs" testID="design-table">
          {wide ? (
            <View role="row" style={[styles.row, styles.tableRow, styles.headerRow]}>
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
          {data?.designs.map((design) =>
            editing === design.id ? (
              <RowEditor key={design.id} design={design} onDone={() => setEditing(null)} />
            ) : wide ? (
              <View
                key={design.id}
                role="row"
                style={[styles.row, styles.tableRow]}
                testID={`design-${design.title}`}
              >
                <View role="cell" style={columnStyle[0]}>
                  {titleCell(design)}
                </View>
                <Text role="cell" variant="small" style={columnStyle[1]}>
                  {design.createdBy?.displayName ?? 'Former member'}
                </Text>
                <Text role="cell" variant="small" tone="muted" style={columnStyle[2]}>
                  {formatDay(design.updatedAt)}
                </Text>
                <Text role="cell" variant="number" style={columnStyle[3]}>
                  v{design.latestVersion}
                </Text>
                <View role="cell" style={columnStyle[4]}>
                  {rowActions(design)}
                </View>
              </View>
            ) : (
              <View key={design.id} role="row" style={styles.block} testID={`design-${design.title}`}>
                {titleCell(design)}
                <Text role="cell" variant="small" tone="muted">
                  {design.createdBy?.displayName ?? 'Former member'} · updated {formatDay(design.updatedAt)} ·
                  v{design.latestVersion}
                </Text>
                {rowActions(design)}
              </View>
            ),
          )}
          {data && data.designs.length === 0 ? (
            <Text tone="muted" style={styles.empty} testID="no-designs">
              {q || tag
                ? 'No design matches.'
                : archived === 'only'
                  ? 'Nothing is archived.'
                  : owner
                    ? 'No designs yet: create the first above.'
                    : 'No designs yet.'}
            </Text>
          ) : null}
          {list.isError ? (
            <Text role="alert" tone="danger">
              {list.error.message}
            </Text>
          ) : null}
          {!data && list.isPending ? <Text tone="muted">Loading designs…</Text> : null}
        </View>
        {data && data.total > 0 ? (
          <View style={styles.paging}>
            <Text variant="small" tone="muted" testID="page-info">
              {first}–{last} of {data.total}
            </Text>
            <View style={styles.row}>
              <Button
                kind="secondary"
                label="Previous"
                onPress={() => setPage((p) => Math.max(1, p - 1))}
                disabled={data.page <= 1}
                testID="page-previous"
              />
              <Button
                kind="secondary"
                label="Next"
                onPress={() => setPage((p) => p + 1)}
                disabled={last >= data.total}
                testID="page-next"
              />
            </View>
          </View>
        ) : null}
      </Card>

      {owner ? (
        <Card title="Import">
          <Text tone="muted">
            A notebook file exported from Blazebook: every version and its notes. Problems are listed with
            their place in the file, and nothing is half-imported.
          </Text>
          <ImportButton onImport={(file) => importFile.mutateAsync(file)} busy={importFile.isPending} />
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  page: { maxWidth: 1100 },
  heading: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  tableRow: {
    flexWrap: 'nowrap',
    gap: space.md,
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  headerRow: { borderBottomWidth: 2 },
  block: { gap: space.xxs, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  titleCell: { gap: space.xxs, alignItems: 'flex-start' },
  marks: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  link: { color: colors.primary, textDecorationLine: 'underline', fontFamily: fonts.semibold },
  rowActions: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'flex-start' },
  filters: { gap: space.md },
  filtersWide: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.xl },
  editor: { gap: space.sm, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  paging: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    justifyContent: 'space-between',
    alignItems: 'center',
    gap: space.sm,
    paddingTop: space.sm,
  },
  empty: { paddingVertical: space.md },
});

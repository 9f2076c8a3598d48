import { useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { can } from '@/shared/teams';
import { TeamSwitcher, useTeamsQuery } from '@/features/teams';
import { Button, Card, Heading, Screen, Text, space, useDocumentTitle, useLayout } from '@/features/ui';
import { useListView } from '../hooks/use-list-view';
import { listQuery, type ListView } from '../list-view';
import { useDesignListQuery, useImportMutation } from '../queries';
import { CreateNotebookCard } from './create-notebook-card';
import { DesignListFilters } from './design-list-filters';
import { DesignTable } from './design-table';
import { ImportButton } from './import-button';
import { ListPaging } from './list-paging';

const pageSize = 20;

/**
 * `/teams/:teamId/notebooks?q=&tag=&review=&sort=&dir=&archived=&page=`: the team's designs with
 * search, tag and review-state filters, sort and pages, the view kept in the URL so it can be linked.
 */
export function NotebookListScreen() {
  const { teamId = '' } = useLocalSearchParams<{ teamId: string }>();
  const wide = useLayout() !== 'phone';
  const teams = useTeamsQuery();
  const team = teams.data?.find((t) => t.id === teamId);
  const owner = can(team?.role, 'designs.edit');
  const [view, changeView] = useListView();
  const [creating, setCreating] = useState(false);
  const list = useDesignListQuery(teamId, listQuery(view, pageSize));
  const importFile = useImportMutation(teamId);
  const router = useRouter();
  // The imported notebook opens at once; its header says it came from a file.
  const importAndOpen = async (file: Parameters<typeof importFile.mutateAsync>[0]) => {
    const made = await importFile.mutateAsync(file);
    router.push(`/notebooks/${made.design.id}` as Href);
  };
  useDocumentTitle(
    teams.data && !team
      ? 'No such team'
      : team
        ? `Designs of ${team.personal ? 'your personal workspace' : team.name}`
        : 'Team designs',
  );

  if (teams.data && !team) {
    return (
      <Screen>
        <Heading level={1}>No such team</Heading>
        <Text tone="muted">It does not exist, or you are not in it.</Text>
      </Screen>
    );
  }

  const data = list.data;
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
        <DesignListFilters view={view} onChange={changeView} tags={data?.tags ?? []} wide={wide} />
      </Card>

      <Card>
        <DesignTable
          designs={data?.designs}
          wide={wide}
          owner={owner}
          emptyText={emptyText(view, owner)}
          error={list.isError ? list.error.message : null}
          loading={list.isPending}
        />
        {data ? (
          <ListPaging
            page={data.page}
            pageSize={data.pageSize}
            total={data.total}
            onPage={(page) => changeView({ page })}
          />
        ) : null}
      </Card>

      {owner ? (
        <Card title="Import">
          <Text tone="muted">
            A notebook file exported from Blazebook: every version, its notes and its review threads and
            decisions. It becomes a new design here, marked as imported, and opens. Problems are listed with
            their place in the file, and nothing is half-imported.
          </Text>
          <ImportButton onImport={importAndOpen} busy={importFile.isPending} />
        </Card>
      ) : null}
    </Screen>
  );
}

function emptyText(view: ListView, owner: boolean): string {
  if (view.q || view.tag || view.review) return 'No design matches.';
  if (view.archived === 'only') return 'Nothing is archived.';
  return owner ? 'No designs yet: create the first above.' : 'No designs yet.';
}

const styles = StyleSheet.create({
  page: { maxWidth: 1100 },
  heading: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
});

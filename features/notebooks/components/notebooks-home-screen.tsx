import { Redirect, type Href } from 'expo-router';
import { useTeamsQuery } from '@/features/teams';
import { Screen, Text, useDocumentTitle } from '@/features/ui';

/** `/notebooks`: the designs of the user's first shared team, else of their personal workspace. */
export function NotebooksHomeScreen() {
  const teams = useTeamsQuery();
  useDocumentTitle('Team notebooks');
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

import { useRouter, type Href } from 'expo-router';
import { RadioGroup } from '@/features/ui';
import { useTeamsQuery } from '../queries';

type Props = {
  currentTeamId?: string;
  /** Which page of the chosen team an option opens. */
  section?: 'members' | 'notebooks';
  testID?: string;
};

/** Every team the user is in, as one scrolling radio group; choosing one opens it. */
export function TeamSwitcher({ currentTeamId, section = 'members', testID = 'team-switcher' }: Props) {
  const teams = useTeamsQuery();
  const router = useRouter();
  if (!teams.data || teams.data.length === 0) return null;
  return (
    <RadioGroup
      label="Your teams"
      options={teams.data.map((team) => ({ value: team.id, label: team.personal ? 'Personal workspace' : team.name }))}
      value={currentTeamId}
      onChange={(teamId) => router.push(`/teams/${teamId}/${section}` as Href)}
      scroll
      testID={testID}
    />
  );
}

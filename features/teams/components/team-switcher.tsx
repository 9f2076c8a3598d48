import { useRouter, type Href } from 'expo-router';
import { Pressable, ScrollView, StyleSheet, Text } from 'react-native';
import { colors, fonts, minTouch, radius, space, type } from '@/features/ui';
import { useTeamsQuery } from '../queries';

type Props = {
  currentTeamId?: string;
  /** Which page of the chosen team a tab opens. */
  section?: 'members' | 'notebooks';
  testID?: string;
};

/** Every team the user is in, as a row of tabs; the current one is marked. */
export function TeamSwitcher({ currentTeamId, section = 'members', testID = 'team-switcher' }: Props) {
  const teams = useTeamsQuery();
  const router = useRouter();
  if (!teams.data || teams.data.length === 0) return null;
  return (
    <ScrollView
      horizontal
      showsHorizontalScrollIndicator={false}
      contentContainerStyle={styles.row}
      role="tablist"
      aria-label="Your teams"
      testID={testID}
    >
      {teams.data.map((team) => {
        const current = team.id === currentTeamId;
        return (
          <Pressable
            key={team.id}
            role="tab"
            aria-selected={current}
            onPress={() => router.push(`/teams/${team.id}/${section}` as Href)}
            style={({ hovered }: { pressed: boolean; hovered?: boolean }) => [
              styles.tab,
              current && styles.current,
              hovered && !current && styles.hovered,
            ]}
          >
            <Text style={[styles.label, current && styles.labelCurrent]} numberOfLines={1}>
              {team.personal ? 'Personal workspace' : team.name}
            </Text>
          </Pressable>
        );
      })}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.sm, paddingVertical: space.xxs },
  tab: {
    minHeight: minTouch - 4,
    justifyContent: 'center',
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    backgroundColor: colors.surface,
    maxWidth: 240,
  },
  current: { backgroundColor: colors.primary, borderColor: colors.primary },
  hovered: { backgroundColor: colors.surfaceSunken },
  label: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  labelCurrent: { color: colors.onPrimary },
});

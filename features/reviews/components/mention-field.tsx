import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Member } from '@/shared/teams';
import { Button, Text, TextField, space } from '@/features/ui';
import { mentionMatches, mentionQuery } from '../mentions';

type Props = {
  label: string;
  value: string;
  onChange: (text: string) => void;
  /** Chosen people, id → display name. */
  chosen: ReadonlyMap<string, string>;
  onChoose: (chosen: Map<string, string>) => void;
  members: readonly Member[];
  userId: string;
  error: string | null;
  testID: string;
  placeholder?: string;
  /** Take the focus when shown (a reply box opened from its button). */
  autoFocus?: boolean;
};

/**
 * A remark's body box with `@` completion: typing `@Tob` offers the team members whose name
 * starts so; choosing one writes `@Display Name ` into the text and remembers their id, which the
 * server checks against the team and tells by inbox and e-mail.
 */
export function MentionField({ label, value, onChange, chosen, onChoose, members, userId, error, testID, placeholder, autoFocus = false }: Props) {
  const query = mentionQuery(value);
  const matches = useMemo(() => (query === null ? [] : mentionMatches(members, query, userId)), [members, query, userId]);
  const choose = (member: Member) => {
    const next = value.replace(/@([^\s@]{0,40})$/u, `@${member.displayName} `);
    const map = new Map(chosen);
    map.set(member.userId, member.displayName);
    onChoose(map);
    onChange(next);
  };
  return (
    <View style={styles.root}>
      <TextField
        label={label}
        value={value}
        onChangeText={onChange}
        multiline
        numberOfLines={4}
        error={error}
        hint="Markdown: *emphasis*, `code`, - lists, links. Type @ to mention a team member."
        placeholder={placeholder}
        autoFocus={autoFocus}
        testID={testID}
      />
      {matches.length > 0 ? (
        <View role="group" aria-label="People to mention" style={styles.matches} testID={`${testID}-mentions`}>
          <Text variant="small" tone="muted">
            Mention:
          </Text>
          {matches.map((member) => (
            <Button
              key={member.userId}
              kind="secondary"
              label={member.displayName}
              accessibilityLabel={`${member.displayName}, mention`}
              onPress={() => choose(member)}
              testID={`mention-${member.userId}`}
            />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.xs },
  matches: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.xs },
});

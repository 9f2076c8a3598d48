import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Member } from '@/shared/teams';
import { Button, Text, TextField, space } from '@/features/ui';

/** The `@word` being typed at the end of the text, if any ("@Tob" → "Tob"). */
export function mentionQuery(text: string): string | null {
  const match = /(?:^|\s)@([^\s@]{0,40})$/u.exec(text);
  return match ? (match[1] ?? '') : null;
}

/** Members whose name has a word starting with the query, at most six. */
export function mentionMatches(members: readonly Member[], query: string, userId: string): Member[] {
  const q = query.toLocaleLowerCase();
  return members
    .filter((m) => m.userId !== userId)
    .filter((m) => q === '' || m.displayName.toLocaleLowerCase().split(/\s+/).some((word) => word.startsWith(q)) || m.displayName.toLocaleLowerCase().startsWith(q))
    .slice(0, 6);
}

/** The ids of chosen people whose `@Name` is still in the text (a deleted mention does not notify). */
export function keptMentions(text: string, chosen: ReadonlyMap<string, string>): string[] {
  return [...chosen].filter(([, name]) => text.includes(`@${name}`)).map(([id]) => id);
}

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

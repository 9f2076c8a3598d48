import { StyleSheet, View } from 'react-native';
import { formatDay } from '@/shared/format';
import { roleLabels, type Member, type Role } from '@/shared/teams';
import { Button, Text, colors, fonts, space, useLayout } from '@/features/ui';
import { RolePicker } from './role-picker';

type Props = {
  members: Member[];
  currentUserId: string;
  canManage: boolean;
  busy: boolean;
  onChangeRole: (member: Member, role: Role) => void;
  onRemove: (member: Member) => void;
};

/**
 * Name, e-mail, role and joined date. Wide screens get a real table; phones and tablets get one
 * block per member, since four columns with a role picker do not fit there without cutting e-mails.
 */
export function MembersTable({ members, currentUserId, canManage, busy, onChangeRole, onRemove }: Props) {
  const layout = useLayout();
  const wide = layout === 'wide';
  return (
    <View role="table" aria-label="Team members" testID="members-table">
      {wide ? (
        <View role="row" style={[styles.row, styles.headerRow]}>
          {['Name', 'E-mail', 'Role', 'Joined'].map((title, i) => (
            <Text key={title} role="columnheader" variant="caption" tone="muted" weight="semibold" style={columnStyle[i]}>
              {title.toUpperCase()}
            </Text>
          ))}
        </View>
      ) : null}
      {members.map((member) => {
        const you = member.userId === currentUserId;
        const role = canManage ? (
          <RolePicker
            value={member.role}
            onChange={(next) => onChangeRole(member, next)}
            label={`Role of ${member.displayName}`}
            disabled={busy}
            testID={`role-${member.email}`}
          />
        ) : (
          <Text testID={`role-${member.email}`}>{roleLabels[member.role]}</Text>
        );
        const remove =
          canManage && !you ? (
            <Button kind="quiet" label="Remove" accessibilityLabel={`Remove ${member.displayName} from the team`} onPress={() => onRemove(member)} disabled={busy} />
          ) : null;
        if (!wide) {
          return (
            <View key={member.userId} role="row" style={styles.block} testID={`member-${member.email}`}>
              <Text role="cell" weight="semibold">
                {member.displayName}
                {you ? ' (you)' : ''}
              </Text>
              <Text role="cell" variant="small" tone="muted" selectable>
                {member.email}
              </Text>
              <View role="cell" style={styles.blockLine}>
                {role}
              </View>
              <View style={styles.blockLine}>
                <Text role="cell" variant="small" tone="muted">
                  Joined {formatDay(member.joinedAt)}
                </Text>
                {remove ? <View role="cell">{remove}</View> : null}
              </View>
            </View>
          );
        }
        return (
          <View key={member.userId} role="row" style={styles.row} testID={`member-${member.email}`}>
            <Text role="cell" weight="semibold" style={columnStyle[0]}>
              {member.displayName}
              {you ? ' (you)' : ''}
            </Text>
            <Text role="cell" variant="small" tone="muted" style={columnStyle[1]} selectable>
              {member.email}
            </Text>
            <View role="cell" style={columnStyle[2]}>
              {role}
            </View>
            <View role="cell" style={[columnStyle[3], styles.joined]}>
              <Text variant="small" tone="muted">
                {formatDay(member.joinedAt)}
              </Text>
              {remove}
            </View>
          </View>
        );
      })}
    </View>
  );
}

// The role picker keeps its natural width; the text columns share the rest.
const columnStyle = [
  { flex: 2, minWidth: 0 },
  { flex: 3, minWidth: 0 },
  { width: 236, flexShrink: 0 },
  { flex: 2, minWidth: 0 },
] as const;

const styles = StyleSheet.create({
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingVertical: space.md,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
  headerRow: { paddingVertical: space.sm },
  joined: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  block: { gap: space.xs, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  blockLine: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm, fontFamily: fonts.regular },
});

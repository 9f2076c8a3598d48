import { Link, useRouter, type Href } from 'expo-router';
import { Pressable, StyleSheet, View, type TextStyle } from 'react-native';
import type { Notebook } from '@/shared/notebooks';
import { ReviewStateBadge } from '@/features/reviews';
import { Button, Text, colors, fonts, radius, space, type } from '@/features/ui';
import { formatDay } from '../format';
import { baselineChip, importedOriginText } from '../notices';
import { Badge } from './history-table';

/** A row of the wide design table, shared by the header and every design. */
export const tableRowStyle = StyleSheet.create({
  row: {
    flexDirection: 'row',
    flexWrap: 'nowrap',
    gap: space.md,
    alignItems: 'center',
    paddingVertical: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.line,
  },
}).row;

/** Title, owner, updated, latest version with its review state, actions: the wide table's columns. */
export const columnStyle: TextStyle[] = [
  { flex: 3, minWidth: 0 },
  { flex: 1.2, minWidth: 0 },
  { width: 110 },
  { width: 160 },
  { width: 250 },
];

type Props = {
  design: Notebook;
  /** A table row on wide screens, a stacked block on phones. */
  wide: boolean;
  /** Owners may rename, tag and archive. */
  owner: boolean;
  onEdit: () => void;
  onArchive: () => void;
  archiving: boolean;
};

/** One design in the team's list. */
export function DesignRow({ design, wide, ...actions }: Props) {
  if (wide) {
    return (
      <View role="row" style={tableRowStyle} testID={`design-${design.title}`}>
        <View role="cell" style={columnStyle[0]}>
          <TitleCell design={design} />
        </View>
        <Text role="cell" variant="small" style={columnStyle[1]}>
          {design.createdBy?.displayName ?? 'Former member'}
        </Text>
        <Text role="cell" variant="small" tone="muted" style={columnStyle[2]}>
          {formatDay(design.updatedAt)}
        </Text>
        <View role="cell" style={[columnStyle[3], styles.latestCell]}>
          <Text variant="number">v{design.latestVersion}</Text>
          <ReviewStateBadge state={design.latestReviewState} compact testID={`review-state-${design.title}`} />
        </View>
        <View role="cell" style={columnStyle[4]}>
          <RowActions design={design} {...actions} />
        </View>
      </View>
    );
  }
  const createdBy = design.createdBy?.displayName ?? 'Former member';
  return (
    <View role="row" style={styles.block} testID={`design-${design.title}`}>
      <View role="cell">
        <TitleCell design={design} />
      </View>
      <Text role="cell" variant="small" tone="muted">
        {`${createdBy} · updated ${formatDay(design.updatedAt)} · v${design.latestVersion}`}
      </Text>
      <View role="cell">
        <ReviewStateBadge state={design.latestReviewState} testID={`review-state-${design.title}`} />
      </View>
      {actions.owner ? (
        <View role="cell">
          <RowActions design={design} {...actions} />
        </View>
      ) : null}
    </View>
  );
}

/** The title as a link to the notebook, its baseline and tags, and where it was cloned from. */
function TitleCell({ design }: { design: Notebook }) {
  const router = useRouter();
  return (
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
        {design.baselineVersion !== null ? <BaselineLink design={design} version={design.baselineVersion} /> : null}
        {design.tags.map((t) => (
          <Badge key={t} label={t} tone="primary" />
        ))}
      </View>
      {design.clonedFrom ? (
        <Text variant="caption" tone="muted">
          from {design.clonedFrom.title} v{design.clonedFrom.version}
        </Text>
      ) : null}
      {design.importedAt ? (
        <Text variant="caption" tone="muted" testID={`imported-${design.id}`}>
          {importedOriginText(design.importedAt)}
        </Text>
      ) : null}
    </View>
  );
}

/** The baseline chip opens that version, the one colleagues start from, in one step. */
function BaselineLink({ design, version }: { design: Notebook; version: number }) {
  const chip = baselineChip(design.title, version);
  return (
    <Link
      href={`/notebooks/${design.id}/v/${version}` as Href}
      accessibilityLabel={chip.accessibleName}
      style={styles.baselineLink}
      testID={`baseline-${design.id}`}
    >
      {chip.label}
    </Link>
  );
}

function RowActions({ design, owner, onEdit, onArchive, archiving }: Omit<Props, 'wide'>) {
  if (!owner) return null;
  return (
    <View style={styles.rowActions}>
      <Button
        kind="quiet"
        label="Rename or tag"
        accessibilityLabel={`Rename or tag ${design.title}`}
        onPress={onEdit}
        testID={`rename-${design.id}`}
      />
      <Button
        kind="quiet"
        label={design.archived ? 'Restore' : 'Archive'}
        accessibilityLabel={`${design.archived ? 'Restore' : 'Archive'} ${design.title}`}
        onPress={onArchive}
        disabled={archiving}
        testID={`archive-${design.id}`}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  block: { gap: space.xxs, paddingVertical: space.md, borderBottomWidth: 1, borderBottomColor: colors.line },
  titleCell: { gap: space.xxs, alignItems: 'flex-start' },
  latestCell: { gap: space.xxs, alignItems: 'flex-start' },
  marks: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  link: { color: colors.primary, textDecorationLine: 'underline', fontFamily: fonts.semibold },
  // A chip that is also a link: the accent fill says "baseline", the underline says "opens";
  // 24 px tall at least (WCAG 2.2 SC 2.5.8, target size minimum).
  baselineLink: {
    ...type.caption,
    lineHeight: 20,
    paddingVertical: 2,
    paddingHorizontal: space.xs,
    borderRadius: radius.sm,
    backgroundColor: colors.accent,
    color: colors.onPrimary,
    fontFamily: fonts.semibold,
    textDecorationLine: 'underline',
  },
  rowActions: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'flex-start' },
});

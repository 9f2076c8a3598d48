import { memo } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { RequirementCheck, RequirementsReport, RequirementStatus, SolvedValue } from '@/features/requirements';
import { Button, Card, colors, fonts, radius, space, type } from '@/features/ui';

/** A value the requirements ask for, offered as one press. */
export type SolveOffer = SolvedValue;

const STATUS_WORDS: Record<RequirementStatus, string> = { pass: 'Pass', fail: 'Fail', unknown: 'Unknown' };

/**
 * The status as a word in a shape: an outline for pass, a solid block for fail, a dashed outline
 * for unknown — so it reads without colour, in print and in grey.
 */
function StatusMark({ status }: { status: RequirementStatus }) {
  return (
    <View style={[styles.mark, status === 'fail' ? styles.markFail : status === 'pass' ? styles.markPass : styles.markUnknown]}>
      <Text style={[styles.markText, status === 'fail' ? styles.markTextFail : null]}>{STATUS_WORDS[status]}</Text>
    </View>
  );
}

function Row({ check }: { check: RequirementCheck }) {
  return (
    <View
      style={styles.row}
      testID={`requirement-${check.id}`}
      role="listitem"
      aria-label={`${STATUS_WORDS[check.status]}: ${check.limitText}. ${check.message}`}
      data-status={check.status}
    >
      <StatusMark status={check.status} />
      <View style={styles.rowText}>
        <Text style={styles.limit}>{check.limitText}</Text>
        <Text style={styles.message}>{check.message}</Text>
      </View>
    </View>
  );
}

type Props = {
  report: RequirementsReport;
  /** Whether the design sets any requirement; when none, the card is one line pointing at the editor. */
  hasAny: boolean;
  offers: readonly SolveOffer[];
  onApplyOffer: (offer: SolveOffer) => void;
  /** After an offer was used: put the design back. */
  undo: { text: string; onUndo: () => void } | null;
  onShowField: (path: string) => void;
  readOnly?: boolean;
  dimmed?: boolean;
};

/** Each requirement beside the results: pass or fail, where it is worst and by how much. */
export const RequirementsCard = memo(function RequirementsCard({
  report,
  hasAny,
  offers,
  onApplyOffer,
  undo,
  onShowField,
  readOnly = false,
  dimmed = false,
}: Props) {
  if (!hasAny) {
    return (
      <Card testID="requirements-card">
        <Text style={styles.invite}>
          No requirements set. Say what the instrument must do (bandpass, resolving power, size…) under Requirements
          in the editor to see pass or fail across the range here.
        </Text>
        {readOnly ? null : (
          <View style={styles.actions}>
            <Button
              kind="secondary"
              label="Add a requirement"
              onPress={() => onShowField('requirements.maxBandpassNm')}
              testID="requirements-add"
            />
          </View>
        )}
      </Card>
    );
  }
  const total = report.checks.length;
  return (
    <Card title="Requirements" testID="requirements-card">
      <Text style={styles.summary} testID="requirements-summary">
        {report.passed} of {total} met
        {report.failed > 0 ? ` · ${report.failed} failing` : ''}
        {report.unknown > 0 ? ` · ${report.unknown} unknown` : ''}
      </Text>
      <View role="list" style={[styles.list, dimmed ? styles.dimmed : null]}>
        {report.checks.map((check) => (
          <Row key={check.id} check={check} />
        ))}
      </View>
      {!readOnly && offers.length > 0 ? (
        <View style={styles.offers}>
          <Text style={styles.offersTitle}>Solve for a value</Text>
          {offers.map((offer) => (
            <View key={offer.id} style={styles.offer}>
              <Text style={styles.offerText}>{offer.text}</Text>
              <Button
                kind="secondary"
                label="Use"
                // The visible word first (WCAG 2.5.3), then what it sets.
                accessibilityLabel={`Use: ${offer.text}`}
                onPress={() => onApplyOffer(offer)}
                testID={`solve-for-${offer.id}`}
              />
            </View>
          ))}
        </View>
      ) : null}
      {undo ? (
        <View style={styles.undo}>
          <Text style={styles.message}>{undo.text}</Text>
          <Button kind="secondary" label="Undo" onPress={undo.onUndo} testID="solve-for-undo" />
        </View>
      ) : null}
    </Card>
  );
});

const styles = StyleSheet.create({
  invite: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  summary: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  list: { gap: space.sm },
  dimmed: { opacity: 0.45 },
  row: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  rowText: { flex: 1, minWidth: 0, gap: space.xxs },
  limit: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  message: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  mark: { minWidth: 64, alignItems: 'center', borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  markPass: { borderWidth: 1.5, borderColor: colors.ok },
  markFail: { borderWidth: 1.5, borderColor: colors.danger, backgroundColor: colors.danger },
  markUnknown: { borderWidth: 1.5, borderStyle: 'dashed', borderColor: colors.inkMuted },
  markText: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink },
  markTextFail: { color: colors.onPrimary },
  offers: { gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  offersTitle: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  offer: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  offerText: { ...type.small, fontFamily: fonts.regular, color: colors.ink, flex: 1, minWidth: 0 },
  undo: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
});

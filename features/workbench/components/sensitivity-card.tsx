import { memo, useDeferredValue, useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { requirementSensitivities, toleranceView } from '@/features/requirements';
import { Card, DisclosureButton, colors, fonts, space, type } from '@/features/ui';
import type { Design } from '@/shared/design';

/** "+10 µm exit slit → +0.017 nm bandpass" without its step, which the row already names. */
function afterStep(text: string, stepText: string): string {
  return text.startsWith(stepText) ? text.slice(stepText.length).replace(/^\s*→\s*/, '') : text;
}

/** The finite differences and tolerances, worked out only while the card is open (about 20 solver runs). */
function Body({ design }: { design: Design }) {
  const rows = useMemo(() => requirementSensitivities(design), [design]);
  const tolerance = useMemo(() => toleranceView(design), [design]);
  const tolerances = [tolerance.slits?.text, tolerance.drive.text, tolerance.focal?.text].filter(
    (text): text is string => Boolean(text),
  );
  return (
    <>
      <Text style={styles.lead}>
        One step of each parameter, and what it does to each requirement’s worst figure (finite differences on the
        same solver).
      </Text>
      <View role="list" style={styles.list} testID="sensitivity-rows">
        {rows.map((row) => (
          <View key={row.path} role="listitem" style={styles.row}>
            <Text style={styles.effect}>
              <Text style={styles.step}>{row.stepText}</Text>
              {' → '}
              {row.effects.map((effect) => afterStep(effect.text, row.stepText)).join('; ')}
            </Text>
          </View>
        ))}
      </View>
      <Text role="heading" aria-level={3} style={styles.heading}>
        Tolerances
      </Text>
      <View role="list" style={styles.list} testID="tolerance-view">
        {tolerances.map((text) => (
          <Text key={text} role="listitem" style={styles.effect}>
            {text}
          </Text>
        ))}
      </View>
    </>
  );
}

type Props = { design: Design; collapsedAtFirst: boolean };

/** How the margins move: the sensitivity table in plain words, and slit, drive and focal tolerances. */
export const SensitivityCard = memo(function SensitivityCard({ design, collapsedAtFirst }: Props) {
  const [open, setOpen] = useState(!collapsedAtFirst);
  // Twenty solver runs per design: they may trail the typing by a frame.
  const deferred = useDeferredValue(design);
  return (
    <Card title="How the margins move" testID="sensitivity-card">
      <View style={styles.actions}>
        <DisclosureButton open={open} onToggle={() => setOpen((o) => !o)} what="the steps and tolerances" testID="sensitivity-toggle" />
      </View>
      {open ? <Body design={deferred} /> : null}
    </Card>
  );
});

const styles = StyleSheet.create({
  lead: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  list: { gap: space.xs },
  row: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xs },
  step: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  effect: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  heading: { ...type.small, fontFamily: fonts.semibold, color: colors.ink, marginTop: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

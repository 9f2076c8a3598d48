import { useState } from 'react';
import { ActivityIndicator, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { PAPER_SIZES, paperLabels, type Paper } from '@/shared/sheets';
import { Button, RadioGroup, Text, colors, space } from '@/features/ui';
import { useSheetDownloadMutation } from '../hooks/use-sheet-download';
import { readPaper, rememberPaper } from '../paper-choice';
import { sheetLabel, type SheetTarget } from '../sheet-target';

const paperOptions = PAPER_SIZES.map((paper) => ({ value: paper, label: paperLabels[paper] }));

type Props = {
  target: SheetTarget;
  /** `sheet-download` unless given; the paper choice is always `sheet-paper`. */
  testID?: string;
  style?: StyleProp<ViewStyle>;
};

/**
 * "Design sheet (PDF)" (or "Compare sheet (PDF)") with the paper beside it. While the server draws
 * the sheet a spinner and a polite status say so; a refusal shows the server's message.
 */
export function SheetButton({ target, testID = 'sheet-download', style }: Props) {
  const [paper, setPaper] = useState<Paper>(readPaper);
  const download = useSheetDownloadMutation(target);
  const label = sheetLabel(target);
  const choose = (next: Paper) => {
    setPaper(next);
    rememberPaper(next);
  };
  const what = target.kind === 'compare' ? 'compare sheet' : 'design sheet';

  return (
    <View style={[styles.root, style]} testID={`${testID}-group`}>
      <View style={styles.controls}>
        <Button
          kind="secondary"
          label={label}
          onPress={() => download.mutate(paper)}
          disabled={download.isPending}
          testID={testID}
        />
        <RadioGroup
          label={`Paper size of the ${what}`}
          options={paperOptions}
          value={paper}
          onChange={choose}
          look="segmented"
          testID="sheet-paper"
        />
      </View>
      {/* Always present, so a screen reader hears what changes inside it. */}
      <View role="status" aria-live="polite" style={styles.status} testID={`${testID}-status`}>
        {download.isPending ? (
          <>
            <ActivityIndicator size="small" color={colors.primary} />
            <Text variant="small" tone="muted">
              Preparing the {what}…
            </Text>
          </>
        ) : download.isSuccess && download.data ? (
          <Text variant="small" tone="ok">
            {download.data}
          </Text>
        ) : null}
      </View>
      {download.isError ? (
        <Text role="alert" variant="small" tone="danger" testID={`${testID}-error`}>
          The {what} could not be made. {download.error.message}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  // Shrinks inside a wrapping row (a toolbar) so its own controls wrap instead of running off a phone.
  root: { flexShrink: 1, maxWidth: '100%', gap: space.xs },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  status: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});

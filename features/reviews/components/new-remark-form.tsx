import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { describedFieldByPath, describedSections, type SectionId } from '@/shared/design-fields';
import {
  pinLabel,
  pinnedFigureLabels,
  pinnedFigures,
  pinnedResultLabels,
  pinnedResults,
  startThreadRequestSchema,
  type Pin,
  type PinnedFigure,
  type PinnedResult,
} from '@/shared/reviews';
import type { Member } from '@/shared/teams';
import { Button, RadioGroup, Text, TextField, colors, radius, space } from '@/features/ui';
import { callProblem, parseProblem } from '../remark-errors';
import { useStartThreadMutation } from '../thread-queries';
import { keptMentions } from '../mentions';
import { MentionField } from './mention-field';

type PinKind = Pin['kind'];
const kindOptions: { value: PinKind; label: string }[] = [
  { value: 'version', label: 'Whole version' },
  { value: 'field', label: 'Design field' },
  { value: 'result', label: 'Result' },
  { value: 'region', label: 'Figure' },
];

type Props = {
  designId: string;
  version: number;
  /** Where the form starts pinned (a marker or a field's thread list); the whole version when null. */
  initialPin: Pin | null;
  /** The read-out wavelength to offer for result pins. */
  defaultWavelengthNm: number;
  members: readonly Member[];
  userId: string;
  onDone: (threadId: string) => void;
  onCancel: () => void;
};

const percentText = (fraction: number) => String(Math.round(fraction * 100));

/**
 * Start a thread: choose what it is pinned to (the whole version, a design field, a result at a
 * wavelength, or a spot on a figure; the figure's centre unless moved), then the first remark.
 */
export function NewRemarkForm({ designId, version, initialPin, defaultWavelengthNm, members, userId, onDone, onCancel }: Props) {
  const start = useStartThreadMutation(designId, version);
  const pin0 = initialPin ?? { kind: 'version' as const };
  const [kind, setKind] = useState<PinKind>(pin0.kind);
  const [path, setPath] = useState(pin0.kind === 'field' ? pin0.path : 'slits.exitWidthUm');
  const [section, setSection] = useState<SectionId>((describedFieldByPath.get(path)?.section ?? 'slits') as SectionId);
  const [result, setResult] = useState<PinnedResult>(pin0.kind === 'result' ? pin0.result : 'bandpass');
  const [wavelength, setWavelength] = useState(String(pin0.kind === 'result' ? pin0.wavelengthNm : defaultWavelengthNm));
  const [figure, setFigure] = useState<PinnedFigure>(pin0.kind === 'region' ? pin0.figure : 'sketch');
  const [across, setAcross] = useState(percentText(pin0.kind === 'region' ? pin0.x : 0.5));
  const [down, setDown] = useState(percentText(pin0.kind === 'region' ? pin0.y : 0.5));
  const [body, setBody] = useState('');
  const [chosen, setChosen] = useState<ReadonlyMap<string, string>>(new Map());
  const [error, setError] = useState<string | null>(null);

  const sectionFields = describedSections.find((s) => s.id === section)?.fields ?? [];
  const number = (text: string) => (text.trim() === '' ? Number.NaN : Number(text.replace(',', '.')));
  const pin = (): unknown => {
    switch (kind) {
      case 'version':
        return { kind };
      case 'field':
        return { kind, path };
      case 'result':
        return { kind, result, wavelengthNm: number(wavelength) };
      case 'region':
        return { kind, figure, x: number(across) / 100, y: number(down) / 100 };
    }
  };

  const submit = async () => {
    setError(null);
    const checked = startThreadRequestSchema.safeParse({ pin: pin(), body, mentions: keptMentions(body, chosen) });
    if (!checked.success) {
      setError(parseProblem(checked.error));
      return;
    }
    try {
      const { thread } = await start.mutateAsync(checked.data);
      onDone(thread.id);
    } catch (failure) {
      setError(callProblem(failure, 'The remark could not be sent. It is still in the box; try again.'));
    }
  };

  const previewPin = startThreadRequestSchema.shape.pin.safeParse(pin());
  return (
    <View style={styles.root} testID="new-remark-form">
      <Text weight="semibold" role="heading" aria-level={3}>
        New remark on v{version}
      </Text>
      <RadioGroup label="Pinned to" showLabel options={kindOptions} value={kind} onChange={setKind} size="compact" testID="pin-kind" />
      {kind === 'field' ? (
        <>
          <RadioGroup
            label="Section"
            showLabel
            options={describedSections.map((s) => ({ value: s.id, label: s.title }))}
            value={section}
            onChange={(next) => {
              setSection(next);
              const first = describedSections.find((s) => s.id === next)?.fields[0];
              if (first) setPath(first.path);
            }}
            size="compact"
            testID="pin-section"
          />
          <RadioGroup
            label="Field"
            showLabel
            options={sectionFields.map((f) => ({ value: f.path, label: f.label }))}
            value={path}
            onChange={setPath}
            size="compact"
            testID="pin-field"
          />
        </>
      ) : null}
      {kind === 'result' ? (
        <>
          <RadioGroup
            label="Result"
            showLabel
            options={pinnedResults.map((r) => ({ value: r, label: pinnedResultLabels[r] }))}
            value={result}
            onChange={setResult}
            size="compact"
            testID="pin-result"
          />
          <TextField label="At wavelength" value={wavelength} onChangeText={setWavelength} unit="nm" numeric inputMode="decimal" testID="pin-wavelength" />
        </>
      ) : null}
      {kind === 'region' ? (
        <>
          <RadioGroup
            label="Figure"
            showLabel
            options={pinnedFigures.map((f) => ({ value: f, label: pinnedFigureLabels[f] }))}
            value={figure}
            onChange={setFigure}
            size="compact"
            testID="pin-figure"
          />
          <View style={styles.row}>
            <View style={styles.half}>
              <TextField label="Across the figure" value={across} onChangeText={setAcross} unit="%" numeric inputMode="decimal" hint="0 left, 100 right" testID="pin-x" />
            </View>
            <View style={styles.half}>
              <TextField label="Down the figure" value={down} onChangeText={setDown} unit="%" numeric inputMode="decimal" hint="0 top, 100 bottom" testID="pin-y" />
            </View>
          </View>
        </>
      ) : null}
      <Text variant="small" tone="muted" testID="pin-preview">
        Pinned to: {previewPin.success ? pinLabel(previewPin.data) : '…'}
      </Text>
      <MentionField
        label="Remark"
        value={body}
        onChange={(text) => {
          setBody(text);
          setError(null);
        }}
        chosen={chosen}
        onChoose={setChosen}
        members={members}
        userId={userId}
        error={null}
        autoFocus
        testID="new-remark-body"
      />
      {error ? (
        <Text role="alert" tone="danger" weight="semibold" testID="new-remark-error">
          {error}
        </Text>
      ) : null}
      <View style={styles.actions}>
        <Button label={start.isPending ? 'Sending…' : 'Start thread'} onPress={() => void submit()} disabled={start.isPending} testID="start-thread" />
        <Button kind="quiet" label="Cancel" onPress={onCancel} testID="cancel-remark" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surfaceSunken },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  half: { flexGrow: 1, flexBasis: 140 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});

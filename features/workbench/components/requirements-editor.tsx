import { Fragment, memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Text, TextField } from '@/features/ui';
import { formatTypedNumber } from '@/shared/format';
import type { FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';
import {
  bandpassBasisOptions,
  oneShotOptions,
  orderOverlapOptions,
  requirementTextFields,
  type RequirementFieldSpec,
  type RequirementsText,
} from '../requirement-fields';
import { carriesOwnUnit } from '../form-model';
import { ReviewMarker } from '../field-marks';
import { ChoiceRow } from './choice-row';
import { EditorSection } from './editor-section';

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

/** One typed requirement: text as typed, its unit beside it until the text names its own. */
const RequirementInput = memo(function RequirementInput({
  control,
  field,
  highlighted,
  readOnly,
}: {
  control: Control<FormValues>;
  field: RequirementFieldSpec;
  highlighted: boolean;
  readOnly: boolean;
}) {
  const {
    field: { value, onChange, onBlur, ref },
    fieldState,
  } = useController({ control, name: field.path as Path });
  const text = typeof value === 'string' ? value : '';
  const [focused, setFocused] = useState(false);
  const suffix = field.unitLabel && !carriesOwnUnit(text) ? field.unitLabel : undefined;
  return (
    <View style={styles.root}>
      <TextField
        ref={ref}
        label={field.label}
        value={text}
        onChangeText={(next) => {
          markEditStart();
          onChange(next);
        }}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          onBlur();
        }}
        editable={!readOnly}
        error={fieldState.error?.message ?? null}
        hint={focused || field.reading === 'fraction' || field.reading === 'nm-list' ? field.help : text === '' ? 'not required' : null}
        unit={suffix}
        numeric
        highlighted={highlighted}
        autoCapitalize="none"
        autoCorrect={false}
        testID={`field-${field.path}`}
      />
      <View style={styles.marker}>
        <ReviewMarker target={field.path} label={field.label} />
      </View>
    </View>
  );
});

function OneShotPicker({ control, readOnly }: { control: Control<FormValues>; readOnly: boolean }) {
  const { field } = useController({ control, name: 'requirements.oneShotCoverage' });
  return (
    <ChoiceRow
      label="Whole range in one shot"
      options={oneShotOptions}
      value={field.value === 'true' ? 'on' : 'off'}
      disabled={readOnly}
      testID="field-requirements.oneShotCoverage"
      onChange={(choice) => {
        markEditStart();
        // Off is "not required": the block keeps no `false` unless a stored version had one.
        field.onChange(choice === 'on' ? 'true' : '');
      }}
    />
  );
}

function OverlapPicker({ control, readOnly }: { control: Control<FormValues>; readOnly: boolean }) {
  const { field } = useController({ control, name: 'requirements.orderOverlap' });
  return (
    <ChoiceRow
      label="Overlapping orders"
      options={orderOverlapOptions}
      value={field.value === '' ? 'none' : field.value}
      disabled={readOnly}
      testID="field-requirements.orderOverlap"
      onChange={(choice) => {
        markEditStart();
        field.onChange(choice === 'none' ? '' : choice);
      }}
    />
  );
}

function BandpassBasisPicker({ control, readOnly }: { control: Control<FormValues>; readOnly: boolean }) {
  const { field } = useController({ control, name: 'requirements.bandpassBasis' });
  return (
    <ChoiceRow
      label="Bandpass judged on"
      options={bandpassBasisOptions}
      value={field.value === 'traced' ? 'traced' : 'slit-limited'}
      disabled={readOnly}
      testID="field-requirements.bandpassBasis"
      onChange={(choice) => {
        markEditStart();
        // Slit-limited is the default: the block keeps no basis unless a stored version named one.
        field.onChange(choice === 'traced' ? 'traced' : field.value === 'slit-limited' ? 'slit-limited' : '');
      }}
    />
  );
}

/** "bandpass ≤ 0.5 nm · R ≥ 2000 · +3 more" while folded. */
export function requirementsSummary(text: RequirementsText): string {
  const parts: string[] = [];
  if (text.maxBandpassNm.trim()) {
    parts.push(`${text.bandpassBasis === 'traced' ? 'traced bandpass' : 'bandpass'} ≤ ${formatTypedNumber(text.maxBandpassNm)}`);
  }
  if (text.minResolvingPower.trim()) parts.push(`R ≥ ${formatTypedNumber(text.minResolvingPower)}`);
  const typed = requirementTextFields.filter((f) => {
    const value = f.key.startsWith('maxFootprintMm.')
      ? text.maxFootprintMm[f.key.slice('maxFootprintMm.'.length) as 'widthMm' | 'depthMm']
      : (text as unknown as Record<string, string>)[f.key];
    return (value ?? '').trim() !== '';
  }).length + (text.oneShotCoverage === 'true' ? 1 : 0) + (text.orderOverlap ? 1 : 0);
  if (typed === 0) return 'none: the design is not checked';
  const more = typed - parts.length;
  return more > 0 ? [...parts, parts.length ? `+${more} more` : `${more} set`].join(' · ') : parts.join(' · ');
}

type Props = {
  control: Control<FormValues>;
  values: RequirementsText;
  collapsible: boolean;
  open: boolean;
  onToggle: () => void;
  highlightedPath: string | null;
  readOnly: boolean;
};

/** What the instrument must do: each limit optional, checked beside the results. */
export const RequirementsEditor = memo(function RequirementsEditor({
  control,
  values,
  collapsible,
  open,
  onToggle,
  highlightedPath,
  readOnly,
}: Props) {
  return (
    <EditorSection
      title="Requirements"
      summary={requirementsSummary(values)}
      open={open}
      collapsible={collapsible}
      onToggle={onToggle}
      testID="section-requirements"
    >
      <Text variant="small" tone="muted">
        What the instrument must do. Leave a field empty when it does not matter; each one set is checked across
        the range beside the results.
      </Text>
      {requirementTextFields.map((field) => (
        <Fragment key={field.path}>
          <RequirementInput
            control={control}
            field={field}
            highlighted={highlightedPath === field.path}
            readOnly={readOnly}
          />
          {field.key === 'maxBandpassNm' ? <BandpassBasisPicker control={control} readOnly={readOnly} /> : null}
        </Fragment>
      ))}
      <OneShotPicker control={control} readOnly={readOnly} />
      <OverlapPicker control={control} readOnly={readOnly} />
    </EditorSection>
  );
});

const styles = StyleSheet.create({
  root: { position: 'relative' },
  marker: { position: 'absolute', top: -2, right: 0 },
});

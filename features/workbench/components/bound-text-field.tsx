import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { TextField } from '@/features/ui';
import { formatTypedNumber, withUnit } from '@/shared/format';
import { carriesOwnUnit, type FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

export type BoundTextFieldProps = {
  control: Control<FormValues>;
  /** The form path, which is also the field's testID after `field-` and what errors are keyed by. */
  path: string;
  label: string;
  /** Shown while the field has the focus. */
  help: string;
  /** Shown beside the text until the text names its own unit; empty for none. */
  unit: string;
  highlighted: boolean;
  /**
   * The canonical text the typed text reads as ("390" for "0.39 µm"), or null while it does not
   * read: shown as "= 390 nm" while it differs, and put in place of the typed text on blur.
   */
  canonical?: (text: string) => string | null;
};

/**
 * A typed field of a card's list or block bound to the editor's form (filter rows, the light
 * input): a refused value keeps its text and shows the shared schema's message, like the design's
 * own fields.
 */
export const BoundTextField = memo(function BoundTextField({ control, path, label, help, unit, highlighted, canonical }: BoundTextFieldProps) {
  const {
    field: { ref, value, onChange, onBlur },
    fieldState,
  } = useController({ control, name: path as Path });
  const text = typeof value === 'string' ? value : '';
  const [focused, setFocused] = useState(false);
  const reading = canonical && text.trim() !== '' ? canonical(text) : null;
  const differs = reading !== null && reading !== text.trim();
  const hint = differs ? `= ${withUnit(formatTypedNumber(reading), unit)}` : focused ? help : null;
  return (
    <View style={styles.field}>
      <TextField
        ref={ref}
        label={label}
        value={text}
        onChangeText={(next) => {
          markEditStart();
          onChange(next);
        }}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          if (differs && !fieldState.error) onChange(reading);
          onBlur();
        }}
        error={fieldState.error?.message ?? null}
        hint={hint}
        unit={unit && !carriesOwnUnit(text) ? unit : undefined}
        numeric
        highlighted={highlighted}
        inputMode="text"
        autoCapitalize="none"
        autoCorrect={false}
        testID={`field-${path}`}
      />
    </View>
  );
});

/** Fields two abreast where there is room. */
export const boundFieldGrid = StyleSheet.create({ grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 } }).grid;

const styles = StyleSheet.create({
  field: { flexGrow: 1, flexBasis: 140, minWidth: 140 },
});

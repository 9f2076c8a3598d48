import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Button, TextField } from '@/features/ui';
import type { FieldSpec } from '../fields';
import { formatTypedNumber, withUnit } from '@/shared/format';
import { canonicalText, carriesOwnUnit, stepValue, type FormValues } from '../form-model';
import { ReviewMarker } from '../field-marks';
import { markEditStart } from '../perf-marks';
import { stepKeyProps } from '../step-keys';

type Props = {
  control: Control<FormValues>;
  field: FieldSpec;
  highlighted: boolean;
  readOnly?: boolean;
};

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

/**
 * One design value: typed with any unit the field understands, shown with its canonical reading
 * ("= 500 mm"), nudged by touch-sized steppers or ArrowUp/ArrowDown (×10 with Shift), and
 * normalised to the canonical number on blur. The unit suffix steps aside while the text names
 * its own unit, so "−25 µm" never reads "−25 µm µm".
 */
export const FieldInput = memo(function FieldInput({ control, field, highlighted, readOnly = false }: Props) {
  const { field: input, fieldState } = useController({ control, name: field.path as Path });
  const text = typeof input.value === 'string' ? input.value : '';
  const canonical = field.kind === 'quantity' ? canonicalText(field, text) : null;
  const unitLabel = field.kind === 'quantity' ? field.unitLabel : undefined;
  const suffix = unitLabel && !carriesOwnUnit(text) ? unitLabel : undefined;
  // While typing, say what the field wants; once it reads, say what it was read as.
  const [focused, setFocused] = useState(false);
  const hint =
    canonical !== null
      ? `= ${withUnit(formatTypedNumber(canonical), unitLabel)}`
      : focused
        ? field.help
        : field.optional && text === ''
          ? 'optional'
          : null;
  const change = (next: string) => {
    markEditStart();
    input.onChange(next);
  };
  const step = (direction: 1 | -1, times = 1): boolean => {
    const next = stepValue(field, text, direction, times);
    if (next === null) return false;
    if (next !== text) change(next);
    return true;
  };
  const stepperLabel = field.label.toLowerCase();
  return (
    <View style={styles.root}>
      <TextField
        ref={input.ref}
        label={field.label}
        value={text}
        onChangeText={change}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          if (canonical !== null && !fieldState.error) input.onChange(canonical);
          input.onBlur();
        }}
        editable={!readOnly}
        error={fieldState.error?.message ?? null}
        hint={hint}
        unit={suffix}
        {...(readOnly ? {} : stepKeyProps(step))}
        numeric
        highlighted={highlighted}
        inputMode={field.kind === 'integer' ? 'numeric' : 'text'}
        autoCapitalize="none"
        autoCorrect={false}
        testID={`field-${field.path}`}
        before={
          readOnly ? null : (
            <Button
              kind="secondary"
              label="−"
              accessibilityLabel={`Decrease ${stepperLabel}`}
              onPress={() => step(-1)}
            />
          )
        }
        after={
          readOnly ? null : (
            <Button
              kind="secondary"
              label="+"
              accessibilityLabel={`Increase ${stepperLabel}`}
              onPress={() => step(1)}
            />
          )
        }
      />
      {/* Beside the label: the open remarks pinned to this field, when there are any. */}
      <View style={styles.marker}>
        <ReviewMarker target={field.path} label={field.label} />
      </View>
    </View>
  );
});

const styles = StyleSheet.create({
  root: { position: 'relative' },
  marker: { position: 'absolute', top: -2, right: 0 },
});

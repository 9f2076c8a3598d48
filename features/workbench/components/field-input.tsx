import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { Button, TextField } from '@/features/ui';
import type { FieldSpec } from '../fields';
import { canonicalText, stepValue, type FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';

type Props = {
  control: Control<FormValues>;
  field: FieldSpec;
  highlighted: boolean;
  readOnly?: boolean;
};

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

/**
 * One design value: typed with any unit the field understands, shown with its canonical reading
 * ("= 500 mm"), nudged by touch-sized steppers, and normalised to the canonical number on blur.
 */
export const FieldInput = memo(function FieldInput({ control, field, highlighted, readOnly = false }: Props) {
  const { field: input, fieldState } = useController({ control, name: field.path as Path });
  const text = typeof input.value === 'string' ? input.value : '';
  const canonical = field.kind === 'quantity' ? canonicalText(field, text) : null;
  const unitLabel = field.kind === 'quantity' ? field.unitLabel : undefined;
  // While typing, say what the field wants; once it reads, say what it was read as.
  const [focused, setFocused] = useState(false);
  const hint =
    canonical !== null
      ? `= ${canonical} ${unitLabel ?? ''}`.trim()
      : focused
        ? field.help
        : field.optional && text === ''
          ? 'optional'
          : null;
  const change = (next: string) => {
    markEditStart();
    input.onChange(next);
  };
  const step = (direction: 1 | -1) => {
    const next = stepValue(field, text, direction);
    if (next !== null) change(next);
  };
  const stepperLabel = field.label.toLowerCase();
  return (
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
      unit={unitLabel}
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
  );
});

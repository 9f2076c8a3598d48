import { memo, useState } from 'react';
import { TextField } from '@/features/ui';
import { formatNumber, withUnit } from '@/shared/format';
import { carriesOwnUnit, readFieldText, type CalculatorField } from '../field-reading';

type Props = {
  field: CalculatorField;
  value: string;
  onChange: (text: string) => void;
  /** The message naming the field, when its value is refused. */
  error?: string | null;
  testID: string;
};

/**
 * One calculator value, as the workbench's fields behave: typed with any unit the field reads,
 * the unit after the box stepping aside while the text names its own, the reading shown once the
 * text has units ("= 550 nm"), the field's help while it has the focus, and its message when refused.
 */
export const CalculatorFieldInput = memo(function CalculatorFieldInput({ field, value, onChange, error, testID }: Props) {
  const [focused, setFocused] = useState(false);
  const read = readFieldText(field, value);
  const reading =
    read.ok && typeof read.value === 'number' && carriesOwnUnit(value) && field.reading !== 'fraction'
      ? `= ${withUnit(formatNumber(read.value, 6), field.unitLabel)}`
      : read.ok && typeof read.value === 'number' && field.reading === 'fraction' && value.includes('%')
        ? `= ${formatNumber(read.value, 6)}`
        : null;
  const hint = reading ?? (focused ? field.help : field.optional && value.trim() === '' ? 'optional' : null);
  return (
    <TextField
      label={field.label}
      value={value}
      onChangeText={onChange}
      onFocus={() => setFocused(true)}
      onBlur={() => setFocused(false)}
      error={error ?? null}
      hint={hint}
      unit={field.unitLabel && !carriesOwnUnit(value) ? field.unitLabel : undefined}
      numeric
      inputMode={field.reading === 'integer' ? 'numeric' : 'text'}
      autoCapitalize="none"
      autoCorrect={false}
      testID={testID}
    />
  );
});

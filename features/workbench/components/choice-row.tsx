import { useMemo } from 'react';
import { RadioGroup } from '@/features/ui';

type Option<T extends string> = { value: T; label: string; description?: string };

type Props<T extends string> = {
  label: string;
  options: readonly Option<T>[];
  value: T | null;
  onChange: (value: T) => void;
  disabled?: boolean;
  testID?: string;
};

/** A labelled row of mutually exclusive choices; a description is read out after its label. */
export function ChoiceRow<T extends string>({ label, options, value, onChange, disabled = false, testID }: Props<T>) {
  const described = useMemo(
    () =>
      options.map((option) => ({
        value: option.value,
        label: option.label,
        accessibilityLabel: option.description ? `${option.label}: ${option.description}` : undefined,
      })),
    [options],
  );
  return (
    <RadioGroup
      label={label}
      showLabel
      options={described}
      value={value}
      onChange={onChange}
      disabled={disabled}
      testID={testID}
    />
  );
}

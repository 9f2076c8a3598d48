import { RadioGroup } from '@/features/ui';

type Props<T extends string> = {
  label: string;
  options: readonly { value: T; label: string }[];
  value: T;
  onChange: (value: T) => void;
  testID: string;
};

/** A small single choice drawn as toggles, with its name above. */
export function ChoiceChips<T extends string>({ label, options, value, onChange, testID }: Props<T>) {
  return <RadioGroup label={label} showLabel options={options} value={value} onChange={onChange} size="compact" testID={testID} />;
}

import { Button } from './button';

type Props = {
  open: boolean;
  onToggle: () => void;
  /** What it shows and hides, as the label's object: "the light budget". */
  what: string;
  testID?: string;
};

/**
 * "Show the light budget ▾" / "Hide the light budget ▴": the one disclosure button of the
 * workbench's collapsible cards, with its state for screen readers (aria-expanded) and the arrow
 * kept out of the spoken name.
 */
export function DisclosureButton({ open, onToggle, what, testID }: Props) {
  const label = `${open ? 'Hide' : 'Show'} ${what}`;
  return (
    <Button
      kind="secondary"
      label={`${label} ${open ? '▴' : '▾'}`}
      accessibilityLabel={label}
      expanded={open}
      onPress={onToggle}
      testID={testID}
    />
  );
}

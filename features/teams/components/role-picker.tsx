import { roleLabels, roles, type Role } from '@/shared/teams';
import { RadioGroup } from '@/features/ui';

type Props = {
  value: Role;
  onChange: (role: Role) => void;
  /** Names the group for screen readers, e.g. "Role of Ada Lindqvist". */
  label: string;
  disabled?: boolean;
  testID?: string;
};

const options = roles.map((role) => ({ value: role, label: roleLabels[role] }));

/** Three mutually exclusive roles as one segmented control (a radio group to assistive tech). */
export function RolePicker({ value, onChange, label, disabled = false, testID }: Props) {
  return (
    <RadioGroup
      label={label}
      options={options}
      value={value}
      onChange={onChange}
      disabled={disabled}
      look="segmented"
      testID={testID}
    />
  );
}

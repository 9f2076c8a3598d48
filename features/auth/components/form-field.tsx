import { Controller, type Control, type FieldValues, type Path } from 'react-hook-form';
import type { TextInputProps } from 'react-native';
import { TextField } from '@/features/ui';

type Props<T extends FieldValues> = Omit<TextInputProps, 'value' | 'onChangeText' | 'onBlur' | 'style'> & {
  control: Control<T, unknown, FieldValues>;
  name: Path<T>;
  label: string;
  hint?: string;
};

/** A TextField bound to a react-hook-form field; the field's error shows under it. */
export function FormField<T extends FieldValues>({ control, name, label, hint, ...input }: Props<T>) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField
          {...input}
          label={label}
          hint={hint}
          value={(field.value as string | undefined) ?? ''}
          onChangeText={field.onChange}
          onBlur={field.onBlur}
          error={fieldState.error?.message ? `${label} ${fieldState.error.message}` : null}
        />
      )}
    />
  );
}

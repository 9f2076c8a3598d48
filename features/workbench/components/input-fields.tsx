import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { TextField } from '@/features/ui';
import { inputFieldWords, type InputTextKey } from '../input-fields';
import { carriesOwnUnit, type FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

/** One typed field of the light input, bound to the editor's form so refused text keeps its message. */
const InputField = memo(function InputField({
  control,
  fieldKey,
  highlighted,
}: {
  control: Control<FormValues>;
  fieldKey: InputTextKey;
  highlighted: boolean;
}) {
  const path = `input.${fieldKey}`;
  const {
    field: { ref, value, onChange, onBlur },
    fieldState,
  } = useController({ control, name: path as Path });
  const text = typeof value === 'string' ? value : '';
  const [focused, setFocused] = useState(false);
  const words = inputFieldWords[fieldKey];
  return (
    <View style={styles.field}>
      <TextField
        ref={ref}
        label={words.label}
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
        error={fieldState.error?.message ?? null}
        hint={focused ? words.help : null}
        unit={words.unit && !carriesOwnUnit(text) ? words.unit : undefined}
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

/** The light input's fields for the chosen kind, two abreast where there is room. */
export function InputFields({
  control,
  keys,
  highlightedPath,
}: {
  control: Control<FormValues>;
  keys: readonly InputTextKey[];
  highlightedPath: string | null;
}) {
  return (
    <View style={styles.grid}>
      {keys.map((key) => (
        <InputField key={key} control={control} fieldKey={key} highlighted={highlightedPath === `input.${key}`} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
  field: { flexGrow: 1, flexBasis: 140, minWidth: 140 },
});

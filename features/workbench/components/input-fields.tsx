import { View } from 'react-native';
import type { Control } from 'react-hook-form';
import type { FormValues } from '../form-model';
import { inputFieldWords, type InputTextKey } from '../input-fields';
import { BoundTextField, boundFieldGrid } from './bound-text-field';

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
    <View style={boundFieldGrid}>
      {keys.map((key) => {
        const path = `input.${key}`;
        const words = inputFieldWords[key];
        return (
          <BoundTextField
            key={key}
            control={control}
            path={path}
            label={words.label}
            help={words.help}
            unit={words.unit}
            highlighted={highlightedPath === path}
          />
        );
      })}
    </View>
  );
}

import { View } from 'react-native';
import type { Control } from 'react-hook-form';
import { filterFieldWords } from '@/shared/design-fields';
import { formatMachineNumber } from '@/shared/format';
import { FILTER_TEXT_KEYS, filterFieldHelp, readFilterText, type FilterTextKey } from '../filter-fields';
import type { FormValues } from '../form-model';
import { BoundTextField, boundFieldGrid } from './bound-text-field';

/** Any length unit ("0.39 µm", "3900 Å") reads as nm and is normalised to it on blur. */
function nmText(text: string): string | null {
  const read = readFilterText(text);
  return read.ok ? formatMachineNumber(read.value, 17) : null;
}

/** A filter row's four typed fields, two abreast where there is room. */
export function FilterRowFields({
  control,
  index,
  highlightedPath,
}: {
  control: Control<FormValues>;
  index: number;
  highlightedPath: string | null;
}) {
  return (
    <View style={boundFieldGrid}>
      {FILTER_TEXT_KEYS.map((key: FilterTextKey) => {
        const path = `filters.${index}.${key}`;
        return (
          <BoundTextField
            key={key}
            control={control}
            path={path}
            label={filterFieldWords[key].label}
            help={filterFieldHelp[key]}
            unit={filterFieldWords[key].unitLabel}
            highlighted={highlightedPath === path}
            canonical={nmText}
          />
        );
      })}
    </View>
  );
}

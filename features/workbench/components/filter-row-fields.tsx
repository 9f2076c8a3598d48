import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { TextField } from '@/features/ui';
import { filterFieldWords } from '@/shared/design-fields';
import { formatMachineNumber, formatTypedNumber, withUnit } from '@/shared/format';
import { FILTER_TEXT_KEYS, filterFieldHelp, readFilterText, type FilterTextKey } from '../filter-fields';
import { carriesOwnUnit, type FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';

type Path = Parameters<typeof useController<FormValues>>[0]['name'];

/**
 * One typed field of a filter row: any length unit ("0.39 µm", "3900 Å"), read as nm, shown with
 * its reading ("= 390 nm") and normalised to it on blur, like the design's own fields; a refused
 * value keeps its text and shows the shared schema's message.
 */
const FilterField = memo(function FilterField({
  control,
  index,
  fieldKey,
  highlighted,
}: {
  control: Control<FormValues>;
  index: number;
  fieldKey: FilterTextKey;
  highlighted: boolean;
}) {
  const path = `filters.${index}.${fieldKey}`;
  const {
    field: { ref, value, onChange, onBlur },
    fieldState,
  } = useController({ control, name: path as Path });
  const text = typeof value === 'string' ? value : '';
  const [focused, setFocused] = useState(false);
  const read = text.trim() === '' ? null : readFilterText(text);
  const canonical = read?.ok ? formatMachineNumber(read.value, 17) : null;
  const differs = canonical !== null && canonical !== text.trim();
  const unit = filterFieldWords[fieldKey].unitLabel;
  const hint = differs ? `= ${withUnit(formatTypedNumber(canonical), unit)}` : focused ? filterFieldHelp[fieldKey] : null;
  return (
    <View style={styles.field}>
      <TextField
        ref={ref}
        label={filterFieldWords[fieldKey].label}
        value={text}
        onChangeText={(next) => {
          markEditStart();
          onChange(next);
        }}
        onFocus={() => setFocused(true)}
        onBlur={() => {
          setFocused(false);
          if (differs && !fieldState.error) onChange(canonical);
          onBlur();
        }}
        error={fieldState.error?.message ?? null}
        hint={hint}
        unit={carriesOwnUnit(text) ? undefined : unit}
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
    <View style={styles.grid}>
      {FILTER_TEXT_KEYS.map((key) => (
        <FilterField
          key={key}
          control={control}
          index={index}
          fieldKey={key}
          highlighted={highlightedPath === `filters.${index}.${key}`}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: 12 },
  field: { flexGrow: 1, flexBasis: 140, minWidth: 140 },
});

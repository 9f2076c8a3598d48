import { memo, useState } from 'react';
import { useController, type Control, type UseFormSetValue } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Text, space } from '@/features/ui';
import { layoutKindOptions } from '@/shared/design-fields';
import { fieldLabel, sections, type SectionId } from '../fields';
import type { FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';
import { EditorSection } from './editor-section';
import { ChoiceRow } from './choice-row';
import { FieldInput } from './field-input';

function sectionSummary(id: SectionId, v: FormValues): string {
  const or = (text: string, fallback: string) => (text.trim() === '' ? fallback : text);
  switch (id) {
    case 'grating':
      return `${or(v.grating.grooveDensityPerMm, '?')}/mm · order ${or(v.grating.order, '?')}${v.grating.blazeWavelengthNm ? ` · blaze ${v.grating.blazeWavelengthNm} nm` : ''}`;
    case 'layout':
      return `${layoutKindOptions.find((k) => k.value === v.layout.kind)?.label ?? v.layout.kind} · ${or(v.layout.deviationAngleDeg, '?')}° · ${or(v.layout.collimatorFocalMm, '?')}/${or(v.layout.cameraFocalMm, '?')} mm`;
    case 'slits':
      return `${or(v.slits.entranceWidthUm, '?')}/${or(v.slits.exitWidthUm, '?')} µm × ${or(v.slits.heightMm, '?')} mm`;
    case 'range':
      return `${or(v.range.startNm, '?')}–${or(v.range.endNm, '?')} nm`;
    case 'source':
      return v.source.minNm || v.source.maxNm
        ? `${or(v.source.minNm, '?')}–${or(v.source.maxNm, '?')} nm`
        : 'not set';
    case 'detector':
      return v.detector.pixelCount || v.detector.pixelPitchUm
        ? `${or(v.detector.pixelCount, '?')} × ${or(v.detector.pixelPitchUm, '?')} µm`
        : 'none (scanning)';
  }
}

type PickerProps = {
  control: Control<FormValues>;
  setValue: UseFormSetValue<FormValues>;
  collimatorFocalText: string;
  readOnly: boolean;
};

function MountKindPicker({ control, setValue, collimatorFocalText, readOnly }: PickerProps) {
  const { field } = useController({ control, name: 'layout.kind' });
  return (
    <ChoiceRow
      label={fieldLabel('layout.kind')}
      options={layoutKindOptions}
      value={field.value}
      disabled={readOnly}
      testID="mount-kind"
      onChange={(kind) => {
        markEditStart();
        field.onChange(kind);
        // Each mount has one value it cannot do without; set it rather than leave an error behind.
        if (kind === 'littrow') setValue('layout.deviationAngleDeg', '0', { shouldValidate: true });
        if (kind === 'ebert-fastie')
          setValue('layout.cameraFocalMm', collimatorFocalText, { shouldValidate: true });
      }}
    />
  );
}

type Props = {
  control: Control<FormValues>;
  setValue: UseFormSetValue<FormValues>;
  values: FormValues;
  /** Sections fold on a phone. */
  collapsible: boolean;
  highlightedPath: string | null;
  readOnly?: boolean;
};

/** Every field of the design, grouped as a designer thinks about them. */
export const DesignEditor = memo(function DesignEditor({
  control,
  setValue,
  values,
  collapsible,
  highlightedPath,
  readOnly = false,
}: Props) {
  const [open, setOpen] = useState<Record<SectionId, boolean>>({
    grating: true,
    layout: false,
    slits: true,
    range: true,
    source: false,
    detector: false,
  });
  const highlightedSection = highlightedPath?.split('.')[0] as SectionId | undefined;
  return (
    <View style={styles.root} testID="design-editor">
      {sections.map((section) => {
        const isOpen = open[section.id] || highlightedSection === section.id;
        return (
          <EditorSection
            key={section.id}
            title={section.title}
            summary={sectionSummary(section.id, values)}
            open={isOpen}
            collapsible={collapsible}
            onToggle={() => setOpen((o) => ({ ...o, [section.id]: !isOpen }))}
            testID={`section-${section.id}`}
          >
            {section.note ? (
              <Text variant="small" tone="muted">
                {section.note}
              </Text>
            ) : null}
            {section.id === 'layout' ? (
              <MountKindPicker
                control={control}
                setValue={setValue}
                collimatorFocalText={values.layout.collimatorFocalMm}
                readOnly={readOnly}
              />
            ) : null}
            {section.fields.map((field) => (
              <FieldInput
                key={field.path}
                control={control}
                field={field}
                highlighted={highlightedPath === field.path}
                readOnly={readOnly}
              />
            ))}
          </EditorSection>
        );
      })}
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.md },
});

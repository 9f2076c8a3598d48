import { memo, useState } from 'react';
import { useController, type Control } from 'react-hook-form';
import { StyleSheet, View } from 'react-native';
import { Text, space } from '@/features/ui';
import type { LayoutKind } from '@/shared/design';
import { layoutKindOptions } from '@/shared/design-fields';
import { formatTypedNumber, withUnit } from '@/shared/format';
import { fieldLabel, sections, type SectionId } from '../fields';
import { ONE_MIRROR_HIDDEN_PATHS, type FormValues } from '../form-model';
import { markEditStart } from '../perf-marks';
import { EditorSection } from './editor-section';
import { ChoiceRow } from './choice-row';
import { FieldInput } from './field-input';
import { RequirementsEditor } from './requirements-editor';
import { blankRequirementsText } from '../requirement-fields';

/** One line per folded section; numbers as typed, but with a true minus and units that never wrap. */
function sectionSummary(id: SectionId, v: FormValues): string {
  const or = (text: string, fallback: string) => (text.trim() === '' ? fallback : formatTypedNumber(text));
  switch (id) {
    case 'grating':
      return `${or(v.grating.grooveDensityPerMm, '?')}/mm · order ${or(v.grating.order, '?')}${v.grating.blazeWavelengthNm ? ` · blaze ${withUnit(or(v.grating.blazeWavelengthNm, '?'), 'nm')}` : ''}`;
    case 'layout': {
      const kind = layoutKindOptions.find((k) => k.value === v.layout.kind)?.label ?? v.layout.kind;
      const focal =
        v.layout.kind === 'ebert-fastie'
          ? withUnit(or(v.layout.collimatorFocalMm, '?'), 'mm')
          : withUnit(`${or(v.layout.collimatorFocalMm, '?')}/${or(v.layout.cameraFocalMm, '?')}`, 'mm');
      return `${kind} · ${withUnit(or(v.layout.deviationAngleDeg, '?'), '°')} · ${focal}`;
    }
    case 'slits':
      return `${withUnit(`${or(v.slits.entranceWidthUm, '?')}/${or(v.slits.exitWidthUm, '?')}`, 'µm')} × ${withUnit(or(v.slits.heightMm, '?'), 'mm')}`;
    case 'range':
      return withUnit(`${or(v.range.startNm, '?')}–${or(v.range.endNm, '?')}`, 'nm');
    case 'source':
      return v.source.minNm || v.source.maxNm
        ? withUnit(`${or(v.source.minNm, '?')}–${or(v.source.maxNm, '?')}`, 'nm')
        : 'not set';
    case 'detector':
      return v.detector.pixelCount || v.detector.pixelPitchUm
        ? `${or(v.detector.pixelCount, '?')} × ${withUnit(or(v.detector.pixelPitchUm, '?'), 'µm')}`
        : 'none (scanning)';
  }
}

/** Why an Ebert–Fastie shows no camera fields: one short line under the mount choice. */
export const ONE_MIRROR_NOTE =
  'Ebert–Fastie: one mirror is both collimator and camera, so the camera’s focal length and off-axis angle are the collimator’s.';

type PickerProps = {
  control: Control<FormValues>;
  onSwitchMount: (kind: LayoutKind) => void;
  readOnly: boolean;
};

function MountKindPicker({ control, onSwitchMount, readOnly }: PickerProps) {
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
        // The new mount gets a deviation it can work with (the last one typed for it), never a
        // Littrow 0 left behind on a two-mirror mount.
        onSwitchMount(kind);
      }}
    />
  );
}

type Props = {
  control: Control<FormValues>;
  onSwitchMount: (kind: LayoutKind) => void;
  values: FormValues;
  /** Sections fold on a phone. */
  collapsible: boolean;
  highlightedPath: string | null;
  readOnly?: boolean;
};

/** Every field of the design, grouped as a designer thinks about them. */
export const DesignEditor = memo(function DesignEditor({
  control,
  onSwitchMount,
  values,
  collapsible,
  highlightedPath,
  readOnly = false,
}: Props) {
  const [open, setOpen] = useState<Record<SectionId | 'requirements', boolean>>({
    grating: true,
    layout: false,
    slits: true,
    range: true,
    source: false,
    detector: false,
    requirements: false,
  });
  const highlightedSection = highlightedPath?.split('.')[0] as SectionId | 'requirements' | undefined;
  const requirementsOpen = open.requirements || highlightedSection === 'requirements';
  const oneMirror = values.layout.kind === 'ebert-fastie';
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
              <MountKindPicker control={control} onSwitchMount={onSwitchMount} readOnly={readOnly} />
            ) : null}
            {section.id === 'layout' && oneMirror ? (
              <Text variant="small" tone="muted" testID="one-mirror-note">
                {ONE_MIRROR_NOTE}
              </Text>
            ) : null}
            {(oneMirror ? section.fields.filter((f) => !ONE_MIRROR_HIDDEN_PATHS.has(f.path)) : section.fields).map((field) => (
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
      <RequirementsEditor
        control={control}
        values={values.requirements ?? blankRequirementsText()}
        collapsible={collapsible}
        open={requirementsOpen}
        onToggle={() => setOpen((o) => ({ ...o, requirements: !requirementsOpen }))}
        highlightedPath={highlightedPath}
        readOnly={readOnly}
      />
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.md },
});

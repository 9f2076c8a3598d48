import { requirementLabel } from './requirement-fields';
import {
  describedSections,
  fieldLabel as designFieldLabel,
  type DescribedInteger,
  type DescribedQuantity,
  type SectionId,
} from '@/shared/design-fields';

/** Where each editable value sits in the design, and how the editor shows it (from shared/design-fields). */
export type { SectionId };

export type QuantityField = DescribedQuantity;
export type IntegerField = DescribedInteger;
export type FieldSpec = QuantityField | IntegerField;

export type SectionSpec = {
  id: SectionId;
  title: string;
  /** Sections the design may leave out altogether (then their fields stay empty). */
  optional?: boolean;
  note?: string;
  /** The typed-in fields; the mount kind is a choice the editor shows on its own. */
  fields: readonly FieldSpec[];
};

export const sections: readonly SectionSpec[] = describedSections.map((section) => ({
  ...section,
  fields: section.fields.filter((field): field is FieldSpec => field.kind !== 'choice'),
}));

export const allFields: readonly FieldSpec[] = sections.flatMap((section) => section.fields);

export const fieldByPath: ReadonlyMap<string, FieldSpec> = new Map(
  allFields.map((field) => [field.path, field]),
);

/** The editor's label for a design or requirements path, for "fix …" notes; the path itself when unknown. */
export function fieldLabel(path: string): string {
  return requirementLabel(path) ?? designFieldLabel(path);
}

import type { Design } from '@/shared/design';
import { exampleDesign } from '@/shared/design';

type Sections = {
  [K in keyof Design]?: Partial<NonNullable<Design[K]>> | undefined;
};

/** The spec's example design with some fields replaced, section by section. */
export function makeDesign(overrides: Sections = {}): Design {
  const design = structuredClone(exampleDesign) as Design;
  for (const key of Object.keys(overrides) as (keyof Design)[]) {
    const value = overrides[key];
    if (value === undefined) {
      delete design[key];
    } else {
      (design as Record<string, unknown>)[key] = { ...(design[key] as object), ...value };
    }
  }
  return design;
}

/** `1e6 / grooves per mm`, nm: written out here so tests do not lean on the solver's helper. */
export const spacing = (grooveDensityPerMm: number) => 1e6 / grooveDensityPerMm;

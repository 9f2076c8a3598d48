import type { z } from 'zod';

/** Field path → plain-words reason, e.g. `{ "grating.grooveDensityPerMm": "must be greater than 0" }`. */
export type FieldErrors = Record<string, string>;

/** Joins a zod issue path the way users and scripts read it: `slits.exitWidthUm`, `at.2`. */
export function issuePath(path: readonly PropertyKey[]): string {
  return path.length === 0 ? '(body)' : path.map(String).join('.');
}

/** Flattens a zod error into one message per field (the first issue on each path wins). */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issuePath(issue.path);
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/** One line per field, for a CLI's stderr: `grating.order: must be a whole number other than 0`. */
export function formatFieldErrors(fields: FieldErrors): string {
  return Object.entries(fields)
    .map(([path, why]) => `${path}: ${why}`)
    .join('\n');
}

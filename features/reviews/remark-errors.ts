import type { z } from 'zod';
import { ApiError } from '@/features/api';

/** A field of a remark's request in words a person reads: "The remark must be at most 10,000 characters". */
const subjects: Record<string, string> = {
  body: 'The remark',
  mentions: 'The mentions',
  pin: 'The pin',
  'pin.path': 'The design field',
  'pin.result': 'The result',
  'pin.wavelengthNm': 'The wavelength',
  'pin.figure': 'The figure',
  'pin.x': 'The spot across the figure',
  'pin.y': 'The spot down the figure',
};

function subjectFor(path: string): string {
  return subjects[path] ?? subjects[path.split('.').slice(0, 2).join('.')] ?? `The ${path}`;
}

/** The first problem of a failed parse, naming its field. */
export function parseProblem(error: z.ZodError): string {
  const issue = error.issues[0];
  if (!issue) return 'The remark is not valid';
  return `${subjectFor(issue.path.map(String).join('.'))} ${issue.message}`;
}

/** A failed call in words: the server's per-field reasons named, else its message. */
export function callProblem(failure: unknown, fallback: string): string {
  if (failure instanceof ApiError) {
    const fields = Object.entries(failure.fields);
    return fields.length > 0 ? fields.map(([path, why]) => `${subjectFor(path)} ${why}`).join('; ') : failure.message;
  }
  return fallback;
}

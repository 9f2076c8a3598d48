import { z } from 'zod';

/**
 * The plain-words building blocks every stored shape (design, requirements, search) is written
 * with, so a missing field, a wrong type and a misspelt key read the same everywhere.
 */

/** A number, with "is required" for a missing field instead of zod's type jargon. */
export function number() {
  return z.number({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a number') });
}

/** An object section: "is required" when missing, and unknown keys named so typos surface. */
export function section<T extends z.core.$ZodLooseShape>(shape: T) {
  return z.strictObject(shape, {
    error: (issue) => {
      if (issue.code === 'unrecognized_keys') {
        const keys = issue.keys.map((key) => `'${key}'`).join(', ');
        return `has an unknown field ${keys} (check the spelling)`;
      }
      return issue.input === undefined ? 'is required' : 'must be an object';
    },
  });
}

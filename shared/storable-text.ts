import type { FieldErrors } from './validation';

/**
 * Text PostgreSQL cannot keep as it was sent. A NUL is refused by `text` and `jsonb` outright; a
 * lone UTF-16 surrogate (half of a pair, as a broken copy-paste or a script's byte slicing leaves)
 * has no UTF-8 form, so the driver would store U+FFFD in its place and the answer would no longer
 * match what was stored. Both are refused by name instead of being changed silently.
 */
export const nulMessage = 'must not contain the NUL character (U+0000)';
export const surrogateMessage =
  'contains a broken character (a lone UTF-16 surrogate); type or paste it again';

/** Deeper than any body we accept; a bound so a hostile body cannot make the walk below costly. */
export const maxNesting = 64;
export const nestingMessage = `nests more than ${maxNesting} levels deep`;

const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be stored as it is, or null when it can. */
export function unstorableReason(text: string): string | null {
  if (text.includes('\u0000')) return nulMessage;
  if (loneSurrogate.test(text)) return surrogateMessage;
  return null;
}

/**
 * Every string (and object key) in a parsed JSON value, query or path that cannot be stored, by
 * its dotted path (`versions.0.notes`), the way zod errors are reported. Iterative, and it stops
 * at `maxNesting`, so a deeply nested body costs no stack and bounded time.
 */
export function unstorableText(value: unknown, prefix = ''): FieldErrors {
  const found: FieldErrors = {};
  const stack: { value: unknown; path: string; depth: number }[] = [{ value, path: prefix, depth: 0 }];
  const join = (path: string, key: string) => (path === '' ? key : `${path}.${key}`);
  while (stack.length > 0) {
    const { value: current, path, depth } = stack.pop()!;
    if (typeof current === 'string') {
      const reason = unstorableReason(current);
      if (reason) found[path === '' ? '(body)' : path] = reason;
      continue;
    }
    if (typeof current !== 'object' || current === null) continue;
    if (depth >= maxNesting) {
      found[path === '' ? '(body)' : path] = nestingMessage;
      continue;
    }
    for (const [key, child] of Object.entries(current)) {
      const keyReason = unstorableReason(key);
      if (keyReason) {
        found[path === '' ? '(body)' : path] = `has a field name that cannot be stored: it ${keyReason}`;
        continue;
      }
      stack.push({ value: child, path: join(path, key), depth: depth + 1 });
    }
  }
  return found;
}

import { readFileSync } from 'node:fs';

/**
 * The JSON a command-line script reads: a file path or `-` for stdin. Shared by `solve` and
 * `search`, so both name their input and refuse unreadable or malformed JSON the same way.
 */

export type JsonRead = { ok: true; json: unknown } | { ok: false; message: string };

/** How a message names the input: the path, or "stdin". */
export function inputName(input: string): string {
  return input === '-' ? 'stdin' : input;
}

/** The input's text, or why it cannot be read. */
export function readInputText(input: string): { ok: true; text: string } | { ok: false; message: string } {
  try {
    return { ok: true, text: readFileSync(input === '-' ? 0 : input, 'utf8') };
  } catch (error) {
    return { ok: false, message: `cannot read ${inputName(input)}: ${(error as Error).message}` };
  }
}

/** The parsed JSON, or "<input> is not valid JSON: …". */
export function parseInputJson(text: string, input: string): JsonRead {
  try {
    return { ok: true, json: JSON.parse(text) };
  } catch (error) {
    return { ok: false, message: `${inputName(input)} is not valid JSON: ${(error as Error).message}` };
  }
}

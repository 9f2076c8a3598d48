import { readFileSync } from 'node:fs';
import { parseArgs } from 'node:util';
import { UsageError } from './run-command';

/**
 * The JSON a command-line script reads: a file path or `-` for stdin. Shared by `solve`, `search`
 * and `selectors`, so each names its input and refuses unreadable or malformed JSON the same way.
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

export interface InputArgs {
  /** A file path, or `-` for stdin. */
  input: string;
}

const inputOptions = { help: { type: 'boolean', short: 'h' } } as const;

/**
 * A command line of one input (a path or `-`) and `--help` (without `node` and the script);
 * throws a `UsageError` naming what is wrong.
 */
export function parseInputArgs(argv: readonly string[]): InputArgs {
  const { values, positionals, tokens } = parseArgs({
    args: [...argv],
    options: inputOptions,
    allowPositionals: true,
    strict: false,
    tokens: true,
  });
  if (values.help === true) throw new UsageError('');
  for (const token of tokens) {
    if (token.kind === 'option' && !Object.hasOwn(inputOptions, token.name)) throw new UsageError(`unknown option ${token.rawName}`);
  }
  const [input, extra] = positionals;
  if (extra !== undefined) throw new UsageError(`unexpected argument ${extra}`);
  if (input === undefined) throw new UsageError('missing the input file (or - for stdin)');
  return { input };
}

/** An answer, or the text printed before exiting 2. */
export type JsonOutcome<T> = { ok: true; answer: T } | { ok: false; message: string };

/**
 * A JSON-in, JSON-out command: 0 with the answer on stdout; 2 with the reason on stderr for a bad
 * command line (above `usage`; `--help` prints it alone), unreadable input or a refusal.
 */
export async function runJsonCommand<A extends InputArgs, T>(
  argv: readonly string[],
  usage: string,
  parse: (argv: readonly string[]) => A,
  compute: (text: string, args: A) => JsonOutcome<T>,
): Promise<number> {
  let args: A;
  try {
    args = parse(argv);
  } catch (error) {
    if (!(error instanceof UsageError)) throw error;
    process.stderr.write(`${error.message ? `${error.message}\n` : ''}${usage}\n`);
    return 2;
  }
  const input = readInputText(args.input);
  if (!input.ok) {
    process.stderr.write(`${input.message}\n`);
    return 2;
  }
  const outcome = compute(input.text, args);
  if (!outcome.ok) {
    process.stderr.write(`${outcome.message}\n`);
    return 2;
  }
  process.stdout.write(`${JSON.stringify(outcome.answer, null, 2)}\n`);
  return 0;
}

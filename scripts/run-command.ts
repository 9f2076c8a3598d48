/** A bad command line: the message (empty for --help) is printed above USAGE, exit 2. */
export class UsageError extends Error {}

/**
 * Runs a command-line entry point and exits with its code. A thrown error is the command's own
 * failure: its message goes to stderr, without a stack, and the exit code is 1.
 */
export function runCommand(main: () => Promise<number>): void {
  main().then(
    (code) => process.exit(code),
    (error: unknown) => {
      console.error(error instanceof Error ? error.message : error);
      process.exit(1);
    },
  );
}

/** Exit codes of the command-line tool. */
export const EXIT_OK = 0;
/** The input files or their contents cannot be used (the message says where). */
export const EXIT_INPUT = 1;
/** The command line itself is wrong. */
export const EXIT_USAGE = 2;

/** A wrong command line: unknown option, missing value, bad choice. */
export class UsageError extends Error {
  override name = 'UsageError';
}

/** A problem in an input file, located by file, line and column where it can be. */
export class InputFileError extends Error {
  override name = 'InputFileError';
  constructor(
    readonly file: string,
    detail: string,
    readonly line?: number,
    readonly column?: string,
  ) {
    super(
      `${file}${line === undefined ? '' : `, line ${line}`}${column === undefined ? '' : `, column "${column}"`}: ${detail}`,
    );
  }
}

import { EngineError } from '@provenote/shared';
import { runVerifyCommand } from '../bundles/verify-command';
import { runCheck } from './check-command';
import { runClassify } from './classify-command';
import { EXIT_INPUT, EXIT_OK, EXIT_USAGE, InputFileError, UsageError } from './cli-errors';
import { parseArguments, USAGE } from './parse-args';

export interface Output {
  write(text: string): void;
}

/** Runs one command line; returns the exit code. Unexpected errors propagate with their stack. */
export function main(
  argv: readonly string[],
  stdout: Output = process.stdout,
  stderr: Output = process.stderr,
): number | Promise<number> {
  // verify reads a zip archive, which is asynchronous; the other commands stay synchronous.
  if (argv[0] === 'verify') return runVerifyCommand(argv.slice(1), stdout, stderr);
  try {
    const parsed = parseArguments(argv);
    if (parsed.command === 'help') {
      stdout.write(`${USAGE}\n`);
      return EXIT_OK;
    }
    if (parsed.command === 'classify') {
      const result = runClassify(parsed.options);
      stdout.write(
        `classified ${result.assignments.length} samples against ${result.manifest.groups.length} groups; wrote ${parsed.options.out}\n`,
      );
    } else {
      const result = runCheck(parsed.options);
      stdout.write(
        `checked ${result.members.length} members: ${result.returnedToOwnGroup} return to their own group when left out; wrote ${parsed.options.out}\n`,
      );
    }
    return EXIT_OK;
  } catch (error) {
    if (error instanceof UsageError) {
      stderr.write(`error: ${error.message}\n\n${USAGE}\n`);
      return EXIT_USAGE;
    }
    if (error instanceof InputFileError || error instanceof EngineError) {
      stderr.write(`error: ${error.message}\n`);
      return EXIT_INPUT;
    }
    throw error;
  }
}

import { readFile } from 'node:fs/promises';
import { verifyBundle } from './verify-bundle';

interface Output {
  write(text: string): void;
}

export const VERIFY_USAGE = 'Usage: provenote verify BUNDLE.zip';

/**
 * `verify BUNDLE.zip`: prints each problem with the file it concerns; exit 0 only when every file is
 * listed and intact and every recomputed value matches, 1 when the bundle fails, 2 on a wrong command line.
 */
export async function runVerifyCommand(args: readonly string[], stdout: Output, stderr: Output): Promise<number> {
  if (args.length !== 1 || args[0].startsWith('-')) {
    stderr.write(`error: verify takes exactly one bundle file\n\n${VERIFY_USAGE}\n`);
    return 2;
  }
  const [file] = args;
  let bytes: Buffer;
  try {
    bytes = await readFile(file);
  } catch (error) {
    stderr.write(
      `error: ${file}: cannot be read (${(error as NodeJS.ErrnoException).code ?? (error as Error).message})\n`,
    );
    return 1;
  }
  const result = await verifyBundle(bytes);
  for (const note of result.skipped) stdout.write(`skipped: ${note}\n`);
  const study = result.manifest ? ` (${result.manifest.study.title}, ${result.manifest.createdAt})` : '';
  if (result.ok) {
    stdout.write(
      `${file}${study}: ${result.filesChecked} files intact; ${result.valuesCompared} recomputed values match within the stated tolerances\n`,
    );
    return 0;
  }
  for (const problem of result.problems) stderr.write(`${problem.kind}: ${problem.path ?? file}: ${problem.message}\n`);
  stderr.write(`${file}${study}: verification FAILED with ${result.problems.length} problems\n`);
  return 1;
}

import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main } from '../main';

/** Test harness of the command-line specs: fixture paths, temporary folders and a captured run of main(). */
export const fixture = (name: string): string => join(__dirname, name);

export function temporaryDirectory(): string {
  return mkdtempSync(join(tmpdir(), 'provenote-cli-'));
}

export function writeTemporaryCsv(dir: string, name: string, text: string): string {
  const file = join(dir, name);
  writeFileSync(file, text);
  return file;
}

export function run(argv: string[]): { code: number; stdout: string; stderr: string } {
  let stdout = '';
  let stderr = '';
  const code = main(argv, { write: (t) => void (stdout += t) }, { write: (t) => void (stderr += t) });
  // classify and check are synchronous; only verify (not driven from here) returns a promise.
  if (typeof code !== 'number') throw new Error(`run() drives the synchronous commands, not "${argv[0]}"`);
  return { code, stdout, stderr };
}

export function readCsv(file: string): string[][] {
  return readFileSync(file, 'utf8')
    .trim()
    .split('\n')
    .map((line) => line.split(','));
}

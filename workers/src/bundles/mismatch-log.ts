import { parseNumberCell, type CsvTable } from './csv';
import { withinProbability, withinRelative } from './tolerance';

/** At most this many differences are listed per file; the rest are counted. */
const LISTED_PER_FILE = 20;

export interface Mismatch {
  readonly path: string;
  readonly message: string;
}

/** Collects the differences between a bundle's files and the recomputation, a few per file. */
export class MismatchLog {
  private readonly listed = new Map<string, string[]>();
  private readonly counts = new Map<string, number>();
  compared = 0;

  add(path: string, message: string): void {
    this.counts.set(path, (this.counts.get(path) ?? 0) + 1);
    const messages = this.listed.get(path) ?? [];
    if (messages.length < LISTED_PER_FILE) messages.push(message);
    this.listed.set(path, messages);
  }

  /** Compares one number under the tolerance of its kind; `where` names file, row and column. */
  number(
    path: string,
    where: string,
    expected: number,
    actual: number,
    kind: 'relative' | 'probability' | 'exact',
  ): void {
    this.compared++;
    const close =
      kind === 'exact'
        ? expected === actual
        : kind === 'probability'
          ? withinProbability(expected, actual)
          : withinRelative(expected, actual);
    if (!close) this.add(path, `${where}: the bundle has ${actual}, the recomputation gives ${expected}`);
  }

  /** Compares one text cell exactly. */
  text(path: string, where: string, expected: string, actual: string): void {
    this.compared++;
    if (expected !== actual)
      this.add(path, `${where}: the bundle has "${actual}", the recomputation gives "${expected}"`);
  }

  /** Compares a numeric CSV cell; an unreadable cell is a difference, named. */
  cell(
    path: string,
    table: CsvTable,
    row: number,
    column: string,
    expected: number,
    kind: 'relative' | 'probability' | 'exact',
  ): void {
    const where = `line ${row + 2}, ${column}`;
    const text = table.rows[row][table.header.indexOf(column)];
    try {
      this.number(path, where, expected, parseNumberCell(text, where), kind);
    } catch (error) {
      this.add(path, (error as Error).message);
    }
  }

  mismatches(): Mismatch[] {
    return [...this.listed.entries()].flatMap(([path, messages]) => {
      const more = (this.counts.get(path) ?? 0) - messages.length;
      const all = more > 0 ? [...messages, `and ${more} more differences`] : messages;
      return all.map((message) => ({ path, message }));
    });
  }
}

import { writeFileSync } from 'node:fs';

type Cell = string | number | null;

/** Numbers at full precision: String(x) is the shortest text that reads back to the same double. */
function formatCell(cell: Cell): string {
  if (cell === null) return '';
  const text = typeof cell === 'number' ? String(cell) : cell;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(header: readonly string[], rows: readonly (readonly Cell[])[]): string {
  return [header, ...rows].map((row) => row.map(formatCell).join(',')).join('\n') + '\n';
}

export function writeCsv(file: string, header: readonly string[], rows: readonly (readonly Cell[])[]): void {
  writeFileSync(file, toCsv(header, rows));
}

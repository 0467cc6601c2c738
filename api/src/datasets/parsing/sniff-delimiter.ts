import { parse } from 'csv-parse/sync';

export type Delimiter = ',' | ';' | '\t';

const CANDIDATES: Delimiter[] = ['\t', ';', ','];

/**
 * The delimiter that splits the first lines into the most rows of one width (two columns or more). Each
 * candidate is tried with the real CSV parser, so quoted fields such as "1,5" do not mislead the count.
 */
export function sniffDelimiter(text: string): Delimiter {
  const sample = text.split(/\r?\n/, 30).join('\n');
  let best: { delimiter: Delimiter; score: number } = { delimiter: ',', score: 0 };
  for (const delimiter of CANDIDATES) {
    let records: string[][];
    try {
      records = parse(sample, { delimiter, relax_column_count: true, relax_quotes: true, skip_empty_lines: true });
    } catch {
      continue;
    }
    const widths = new Map<number, number>();
    for (const record of records) widths.set(record.length, (widths.get(record.length) ?? 0) + 1);
    const [width, count] = [...widths.entries()].sort((a, b) => b[1] - a[1] || b[0] - a[0])[0] ?? [0, 0];
    if (width < 2) continue;
    const score = count * 1000 + width;
    if (score > best.score) best = { delimiter, score };
  }
  return best.delimiter;
}

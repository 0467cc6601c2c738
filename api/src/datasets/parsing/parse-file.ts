import type { DatasetKind, DatasetMapping, ImportSummary, ParseOptions, StoredColumn } from '@provenote/shared';
import { guessColumns } from './guess-column';
import { type ImportSink, importRows } from './import-rows';
import { type Layout, readLayout } from './layout';
import { resolveMapping } from './resolve-columns';
import { type TableSource, openTable } from './table-source';

export interface FileAnalysis {
  source: TableSource;
  layout: Layout;
  options: ParseOptions;
  /** Guesses from the headers (and units row); a saved mapping for the same layout takes their place. */
  guessedMapping: DatasetMapping;
}

/** Opens a file with detected conventions, or with the ones a person confirmed. */
export async function analyseFile(bytes: Buffer, filename: string, confirmed?: ParseOptions): Promise<FileAnalysis> {
  const source = await openTable(bytes, filename, confirmed ?? {});
  const layout = await readLayout(source, confirmed?.decimalSeparator);
  const options: ParseOptions = {
    delimiter: source.delimiter,
    decimalSeparator: layout.decimalSeparator,
    encoding: source.encoding,
    unitsRow: confirmed ? confirmed.unitsRow : layout.unitsRow !== null,
    sheet: source.sheet,
  };
  if (confirmed && confirmed.unitsRow !== (layout.unitsRow !== null)) {
    layout.firstDataRow += confirmed.unitsRow ? 1 : -1;
  }
  return {
    source,
    layout,
    options,
    guessedMapping: { options, columns: guessColumns(layout.headers, layout.unitsRow) },
  };
}

export interface ImportResult {
  summary: ImportSummary;
  columns: StoredColumn[];
  fingerprint: string;
}

/** Reads the whole file under a confirmed mapping; rows and problems go to the sink as they are read. */
export async function importFile(
  bytes: Buffer,
  filename: string,
  mapping: DatasetMapping,
  kind: DatasetKind | null,
  sink: ImportSink,
): Promise<ImportResult> {
  const { source, layout } = await analyseFile(bytes, filename, mapping.options);
  const resolved = resolveMapping(mapping, layout, kind);
  const summary = await importRows(source, layout, resolved, sink);
  return { summary, columns: resolved.measurements, fingerprint: layout.fingerprint };
}

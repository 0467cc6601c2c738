import {
  type DatasetRow as RowView,
  type DatasetVersion as VersionView,
  type Problem,
  cellFlags,
} from '@provenote/shared';
import type { DatasetFile } from './dataset-file.entity';
import type { DatasetProblem } from './dataset-problem.entity';
import type { DatasetVersion } from './dataset-version.entity';
import type { ImportedRow } from './parsing/import-rows';

export interface StoredRow {
  position: number;
  source_row: number;
  sample_id: string;
  group_name: string | null;
  ppm: (number | null)[];
  original: (number | null)[];
  flags: number[];
  raw: (string | null)[];
  attributes: Record<string, string> | null;
}

export const fileView = (file: DatasetFile) => ({
  id: file.id,
  filename: file.filename,
  sizeBytes: file.sizeBytes,
  sha256: file.sha256,
  format: file.format,
});

export function versionView(version: DatasetVersion & { file: DatasetFile }): VersionView {
  return {
    id: version.id,
    datasetId: version.datasetId,
    number: version.number,
    note: version.note,
    file: fileView(version.file),
    mapping: version.mapping,
    columns: version.columns,
    summary: version.summary,
    createdAt: version.createdAt.toISOString(),
    createdBy: version.createdBy,
  };
}

export function rowView(row: ImportedRow): RowView {
  return {
    row: row.sourceRow,
    sampleId: row.sampleId,
    group: row.group,
    cells: row.flags.map((flag, j) => ({
      ppm: row.ppm[j],
      original: row.original[j],
      flag: cellFlags[flag],
      raw: row.raw[j],
    })),
    attributes: row.attributes ?? {},
  };
}

export const storedRowView = (row: StoredRow): RowView =>
  rowView({
    position: row.position,
    sourceRow: row.source_row,
    sampleId: row.sample_id,
    group: row.group_name,
    ppm: row.ppm,
    original: row.original,
    flags: row.flags,
    raw: row.raw,
    attributes: row.attributes,
  });

export const problemView = (problem: DatasetProblem): Problem => ({
  row: problem.sourceRow,
  column: problem.columnName,
  raw: problem.raw,
  code: problem.code,
  message: problem.message,
  action: problem.action,
});

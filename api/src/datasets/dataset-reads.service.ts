import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { type ProblemsPage, type RowsPage, cellFlags } from '@provenote/shared';
import { DataSource } from 'typeorm';
import { DatasetProblem } from './dataset-problem.entity';
import type { DatasetVersion } from './dataset-version.entity';
import { type StoredRow, problemView, storedRowView } from './dataset-views';

const ROW_COLUMNS = 'position, source_row, sample_id, group_name, ppm, original, flags, raw, attributes';
const EXPORT_BATCH = 5000;

export type ExportValues = 'original' | 'ppm';

function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}
const csvLine = (fields: string[]) => `${fields.map(csvField).join(',')}\r\n`;

/**
 * A cell as text for export: numbers as JavaScript prints them (shortest exact form, decimal point),
 * limits as "<limit", and the file's own text for everything without a number.
 */
function exportCell(value: number | null, flag: number, raw: string | null): string {
  if (cellFlags[flag] === 'below_dl' && value !== null) return `<${value}`;
  if (value !== null) return String(value);
  return raw ?? '';
}

/** Reading a stored version: pages of rows and problems, and the whole version as CSV. */
@Injectable()
export class DatasetReadsService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async rows(version: DatasetVersion, page: number, pageSize: number): Promise<RowsPage> {
    const rows: StoredRow[] = await this.dataSource.query(
      `SELECT ${ROW_COLUMNS} FROM dataset_rows WHERE version_id = $1 AND position > $2 ORDER BY position LIMIT $3`,
      [version.id, (page - 1) * pageSize, pageSize],
    );
    return { page, pageSize, total: version.summary.imported, columns: version.columns, rows: rows.map(storedRowView) };
  }

  async problems(version: DatasetVersion, page: number, pageSize: number): Promise<ProblemsPage> {
    const [problems, total] = await this.dataSource.getRepository(DatasetProblem).findAndCount({
      where: { versionId: version.id },
      order: { position: 'ASC' },
      skip: (page - 1) * pageSize,
      take: pageSize,
    });
    return { page, pageSize, total, problems: problems.map(problemView) };
  }

  /**
   * The version as CSV, streamed in batches: the sample id, the group, the notes and each measurement,
   * either as the file gave it (its header and unit) or in ppm.
   */
  async *exportCsv(version: DatasetVersion, values: ExportValues): AsyncGenerator<string> {
    const headerOf = (role: string) => version.mapping.columns.find((column) => column.role === role)?.header;
    const groupHeader = headerOf('group');
    const hasGroup = groupHeader !== undefined;
    const noteKeys = await this.noteKeys(version.id);
    const measurementHeaders = version.columns.map((column) =>
      values === 'ppm' ? `${column.element} (ppm)` : column.header,
    );
    yield csvLine([
      headerOf('sample_id') ?? 'Sample',
      ...(hasGroup ? [groupHeader] : []),
      ...noteKeys,
      ...measurementHeaders,
    ]);
    for (let after = 0; ; after += EXPORT_BATCH) {
      const rows: StoredRow[] = await this.dataSource.query(
        `SELECT ${ROW_COLUMNS} FROM dataset_rows WHERE version_id = $1 AND position > $2 ORDER BY position LIMIT $3`,
        [version.id, after, EXPORT_BATCH],
      );
      if (rows.length === 0) return;
      let chunk = '';
      for (const row of rows) {
        const numbers = values === 'ppm' ? row.ppm : row.original;
        chunk += csvLine([
          row.sample_id,
          ...(hasGroup ? [row.group_name ?? ''] : []),
          ...noteKeys.map((key) => row.attributes?.[key] ?? ''),
          ...row.flags.map((flag, j) => exportCell(numbers[j], flag, row.raw[j])),
        ]);
      }
      yield chunk;
    }
  }

  private async noteKeys(versionId: string): Promise<string[]> {
    const keys: { key: string }[] = await this.dataSource.query(
      `SELECT DISTINCT jsonb_object_keys(attributes) AS key FROM dataset_rows WHERE version_id = $1 AND attributes IS NOT NULL ORDER BY 1`,
      [versionId],
    );
    return keys.map(({ key }) => key);
  }
}

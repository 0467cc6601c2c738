import { createHash } from 'node:crypto';
import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import type { DatasetMapping, FileLayout, ImportPreview, Problem } from '@provenote/shared';
import { Repository } from 'typeorm';
import { RateLimitService } from '../rate-limit/rate-limit.service';
import { DatasetFile } from './dataset-file.entity';
import { insertFile, readFileContent } from './dataset-file-content';
import { fileView, rowView } from './dataset-views';
import { asHttpErrors } from './import-failures';
import type { ImportedRow } from './parsing/import-rows';
import type { Layout } from './parsing/layout';
import { analyseFile, importFile } from './parsing/parse-file';
import { detectFormat } from './parsing/table-source';
import { SavedMapping } from './saved-mapping.entity';

const PREVIEW_ROWS = 100;
const PREVIEW_PROBLEMS = 500;
/** Uploads per person per hour: far above a lab's working pace, low enough that a script cannot fill the disk. */
export const UPLOADS_PER_USER_PER_HOUR = 100;

/** Uploaded files: kept byte-exact before any import, read for the mapping step and the preview. */
@Injectable()
export class DatasetFilesService {
  constructor(
    @InjectRepository(DatasetFile) private readonly files: Repository<DatasetFile>,
    @InjectRepository(SavedMapping) private readonly savedMappings: Repository<SavedMapping>,
    private readonly rateLimits: RateLimitService,
  ) {}

  /** Stores a file (if it can be read as a table at all) and proposes a mapping for it. */
  async upload(labId: string, userId: string, filename: string, content: Buffer): Promise<FileLayout> {
    await this.rateLimits.consume({
      key: `upload:user:${userId}`,
      limit: UPLOADS_PER_USER_PER_HOUR,
      windowSeconds: 3600,
    });
    return asHttpErrors(async () => {
      const analysis = await analyseFile(content, filename);
      const id = await insertFile(this.files.manager.connection, {
        labId,
        filename,
        format: detectFormat(content, filename),
        sizeBytes: content.length,
        sha256: createHash('sha256').update(content).digest('hex'),
        content,
        uploadedBy: userId,
      });
      const file = await this.files.findOneByOrFail({ id });
      const saved = await this.savedMappings.findOne({ where: { labId, fingerprint: analysis.layout.fingerprint } });
      const useSaved = saved !== null && fitsLayout(saved.mapping, analysis.layout);
      return {
        file: fileView(file),
        headers: analysis.layout.headers,
        unitsRow: analysis.layout.unitsRow,
        fingerprint: analysis.layout.fingerprint,
        sheets: analysis.source.sheets,
        // The columns as saved; the conventions (delimiter, encoding…) as found in this file.
        mapping: useSaved ? { options: analysis.options, columns: saved.mapping.columns } : analysis.guessedMapping,
        mappingSource: useSaved ? 'saved' : 'guessed',
        notes: analysis.layout.notes,
      };
    });
  }

  /** The whole file read under a mapping, nothing stored: counts, the first rows, the first problems. */
  async preview(labId: string, fileId: string, mapping: DatasetMapping): Promise<ImportPreview> {
    const file = await this.withContent(labId, fileId);
    const rows: ImportedRow[] = [];
    const problems: Problem[] = [];
    let problemCount = 0;
    return asHttpErrors(async () => {
      const { summary, columns } = await importFile(file.content, file.filename, mapping, null, {
        rows: async (batch) => void rows.push(...batch.slice(0, PREVIEW_ROWS - rows.length)),
        problems: async (batch) => {
          problemCount += batch.length;
          problems.push(...batch.slice(0, PREVIEW_PROBLEMS - problems.length));
        },
      });
      return { summary, columns, rows: rows.map(rowView), problems, problemCount };
    });
  }

  async withContent(labId: string, fileId: string): Promise<DatasetFile> {
    const file = await this.files.findOneBy({ id: fileId, labId });
    const content = file && (await readFileContent(this.files.manager.connection, labId, fileId));
    if (!file || !content) throw new NotFoundException('No such uploaded file in this lab');
    file.content = content;
    return file;
  }
}

/** A saved mapping is offered again only where it still names the same columns at the same places. */
function fitsLayout(mapping: DatasetMapping, layout: Layout): boolean {
  return mapping.columns.every((column) => layout.headers[column.index] === column.header);
}

import { z } from 'zod';

/** Reference data carry a group column; unknowns are the samples to assign. Students may upload unknowns only. */
export const datasetKinds = ['reference', 'unknowns'] as const;
export const datasetKindSchema = z.enum(datasetKinds);
export type DatasetKind = z.infer<typeof datasetKindSchema>;

/** Units a lab file may report a measurement in; every value is stored in ppm besides its original. */
export const measurementUnits = ['ppm', 'ppb', 'mg/kg', 'µg/g', 'wt% oxide', 'wt% element'] as const;
export const measurementUnitSchema = z.enum(measurementUnits);
export type MeasurementUnit = z.infer<typeof measurementUnitSchema>;

export const columnRoles = ['sample_id', 'group', 'measurement', 'attribute', 'ignore'] as const;
export const columnRoleSchema = z.enum(columnRoles);
export type ColumnRole = z.infer<typeof columnRoleSchema>;

export const columnRoleLabels: Record<ColumnRole, string> = {
  sample_id: 'Sample id',
  group: 'Reference group',
  measurement: 'Measurement',
  attribute: 'Note (kept as text)',
  ignore: 'Leave out',
};

/**
 * What a cell held. The position in this list is the smallint stored in dataset_rows.flags, so new flags
 * go at the end.
 * - measured: a plain number; negative: a number below zero (e.g. after blank correction), kept as is;
 * - below_dl: "<0.5" (the value stored is the limit); below_dl_unstated: "bdl", "<DL" (no limit given);
 * - not_determined: "n.d.", "—"; empty: nothing in the cell; unreadable: text that is none of these.
 */
export const cellFlags = [
  'measured',
  'negative',
  'below_dl',
  'below_dl_unstated',
  'not_determined',
  'empty',
  'unreadable',
] as const;
export const cellFlagSchema = z.enum(cellFlags);
export type CellFlag = z.infer<typeof cellFlagSchema>;

export const cellFlagLabels: Record<CellFlag, string> = {
  measured: 'Measured',
  negative: 'Negative (kept)',
  below_dl: 'Below detection limit',
  below_dl_unstated: 'Below detection, limit not stated',
  not_determined: 'Not determined',
  empty: 'Empty',
  unreadable: 'Not a value',
};

export const parseOptionsSchema = z.object({
  /** Null for spreadsheets. */
  delimiter: z.enum([',', ';', '\t']).nullable(),
  decimalSeparator: z.enum(['.', ',']),
  encoding: z.enum(['utf-8', 'windows-1252']).nullable(),
  /** The row under the header holds units (e.g. "ppm", "wt%"). */
  unitsRow: z.boolean(),
  sheet: z.string().nullable(),
});
export type ParseOptions = z.infer<typeof parseOptionsSchema>;

export const columnMappingSchema = z
  .object({
    /** Zero-based position in the file; headers may repeat, positions do not. */
    index: z.number().int().min(0),
    header: z.string(),
    role: columnRoleSchema,
    /** Measurements: the element symbol the value is stored under, e.g. "Si" for a SiO2 column. */
    element: z.string().trim().min(1).max(40).nullable(),
    unit: measurementUnitSchema.nullable(),
    /** wt% oxide only: the oxide formula, e.g. "Al2O3". */
    oxide: z.string().trim().nullable(),
  })
  .superRefine((column, ctx) => {
    if (column.role !== 'measurement') return;
    if (!column.element) ctx.addIssue({ code: 'custom', path: ['element'], message: 'Name the element measured' });
    if (!column.unit) ctx.addIssue({ code: 'custom', path: ['unit'], message: 'Choose the unit of this column' });
    if (column.unit === 'wt% oxide' && !column.oxide) {
      ctx.addIssue({ code: 'custom', path: ['oxide'], message: 'Give the oxide formula, e.g. SiO2' });
    }
  });
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

export const datasetMappingSchema = z.object({
  options: parseOptionsSchema,
  columns: z.array(columnMappingSchema).min(1),
});
export type DatasetMapping = z.infer<typeof datasetMappingSchema>;

export const uploadedFileSchema = z.object({
  id: z.uuid(),
  filename: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string(),
  format: z.enum(['csv', 'xlsx']),
});
export type UploadedFile = z.infer<typeof uploadedFileSchema>;

/** POST /api/labs/:labId/dataset-files: what was found in the file and a mapping to confirm. */
export const fileLayoutSchema = z.object({
  file: uploadedFileSchema,
  headers: z.array(z.string()),
  unitsRow: z.array(z.string()).nullable(),
  /** The normalised header list; a saved mapping is offered again for a file with the same one. */
  fingerprint: z.string(),
  sheets: z.array(z.string()),
  mapping: datasetMappingSchema,
  mappingSource: z.enum(['saved', 'guessed']),
  notes: z.array(z.string()),
});
export type FileLayout = z.infer<typeof fileLayoutSchema>;

export const importSummarySchema = z.object({
  rowsRead: z.number().int(),
  imported: z.number().int(),
  flagged: z.number().int(),
  rejected: z.number().int(),
  blankRowsSkipped: z.number().int(),
});
export type ImportSummary = z.infer<typeof importSummarySchema>;

export const storedColumnSchema = z.object({
  index: z.number().int(),
  header: z.string(),
  element: z.string(),
  unit: measurementUnitSchema,
  oxide: z.string().nullable(),
  /** value in ppm = original value × factorToPpm. */
  factorToPpm: z.number(),
});
export type StoredColumn = z.infer<typeof storedColumnSchema>;

export const problemSchema = z.object({
  /** Row in the file as a spreadsheet shows it (the header is row 1); null for the file as a whole. */
  row: z.number().int().nullable(),
  column: z.string().nullable(),
  raw: z.string().nullable(),
  code: z.string(),
  message: z.string(),
  /** What the import did about it. */
  action: z.string(),
});
export type Problem = z.infer<typeof problemSchema>;

export const cellSchema = z.object({
  ppm: z.number().nullable(),
  original: z.number().nullable(),
  flag: cellFlagSchema,
  raw: z.string().nullable(),
});

export const datasetRowSchema = z.object({
  row: z.number().int(),
  sampleId: z.string(),
  group: z.string().nullable(),
  cells: z.array(cellSchema),
  attributes: z.record(z.string(), z.string()),
});
export type DatasetRow = z.infer<typeof datasetRowSchema>;

/** POST /api/labs/:labId/dataset-files/:fileId/preview */
export const importPreviewSchema = z.object({
  summary: importSummarySchema,
  columns: z.array(storedColumnSchema),
  rows: z.array(datasetRowSchema),
  problems: z.array(problemSchema),
  problemCount: z.number().int(),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;

export const previewRequestSchema = z.object({ mapping: datasetMappingSchema });

export const createDatasetSchema = z.object({
  name: z.string().trim().min(1, 'Give the dataset a name').max(200),
  kind: datasetKindSchema,
  fileId: z.uuid(),
  mapping: datasetMappingSchema,
});
export type CreateDataset = z.infer<typeof createDatasetSchema>;

export const createVersionSchema = z.object({
  fileId: z.uuid(),
  mapping: datasetMappingSchema,
  note: z.string().trim().max(2000).default(''),
});
export type CreateVersion = z.infer<typeof createVersionSchema>;

export const datasetVersionSchema = z.object({
  id: z.uuid(),
  datasetId: z.uuid(),
  number: z.number().int(),
  note: z.string(),
  file: uploadedFileSchema,
  mapping: datasetMappingSchema,
  columns: z.array(storedColumnSchema),
  summary: importSummarySchema,
  createdAt: z.string(),
  createdBy: z.uuid().nullable(),
});
export type DatasetVersion = z.infer<typeof datasetVersionSchema>;

export const datasetSchema = z.object({
  id: z.uuid(),
  labId: z.uuid(),
  name: z.string(),
  kind: datasetKindSchema,
  createdAt: z.string(),
  versions: z.array(datasetVersionSchema),
});
export type Dataset = z.infer<typeof datasetSchema>;

export const datasetListSchema = z.array(datasetSchema);

export const rowsPageSchema = z.object({
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  columns: z.array(storedColumnSchema),
  rows: z.array(datasetRowSchema),
});
export type RowsPage = z.infer<typeof rowsPageSchema>;

export const problemsPageSchema = z.object({
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  problems: z.array(problemSchema),
});
export type ProblemsPage = z.infer<typeof problemsPageSchema>;

export const pageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(500).default(50),
});

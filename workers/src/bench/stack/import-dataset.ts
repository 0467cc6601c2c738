import type { BenchStack } from './bench-stack';

export interface ImportedDataset {
  readonly datasetId: string;
  readonly versionId: string;
  /** The upload: the file stored and its layout guessed (headers, units, column roles). */
  readonly uploadMs: number;
  /** Creating the dataset: every row parsed, normalised to ppm and stored in PostgreSQL. */
  readonly storeMs: number;
}

/** Imports a CSV the way the web app does: upload, accept the guessed mapping, create the dataset. */
export async function importDataset(
  stack: BenchStack,
  name: string,
  kind: 'reference' | 'unknowns',
  csv: Buffer,
): Promise<ImportedDataset> {
  const base = `/api/labs/${stack.labId}`;
  let started = performance.now();
  const uploaded = await stack.client.upload(`${base}/dataset-files`, name, csv);
  if (uploaded.status !== 201) throw new Error(`upload of ${name}: ${uploaded.status} ${uploaded.body.toString()}`);
  const layout = uploaded.json<{ file: { id: string }; mapping: unknown }>();
  const uploadMs = performance.now() - started;
  started = performance.now();
  const created = await stack.client.ok('POST', `${base}/datasets`, {
    name,
    kind,
    fileId: layout.file.id,
    mapping: layout.mapping,
  });
  const storeMs = performance.now() - started;
  const dataset = created.json<{ id: string; versions: { id: string }[] }>();
  return { datasetId: dataset.id, versionId: dataset.versions[0].id, uploadMs, storeMs };
}

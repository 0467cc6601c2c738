import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ENGINE_VERSION } from '@provenote/shared';
import type { ReferenceFit } from './fit-reference';
import type { Features } from './prepare-features';
import type { DataOptions } from './parse-args';
import type { Table } from './read-table';

/** The record of a run: what was asked, on which inputs (by SHA-256), with which engine. */
export function runManifest(
  command: string,
  options: DataOptions,
  inputs: Record<string, Table>,
  elements: readonly string[],
  features: Features,
  fit: ReferenceFit,
  extra: Record<string, unknown>,
) {
  return {
    command,
    engineVersion: ENGINE_VERSION,
    createdAt: new Date().toISOString(),
    parameters: { ...options },
    elements,
    inputs: Object.fromEntries(
      Object.entries(inputs).map(([role, table]) => [
        role,
        { path: table.file, sha256: table.sha256, rows: table.rows.length },
      ]),
    ),
    variables: features.variables,
    imputedCells: features.imputedCells,
    groups: fit.models.map((model, k) => ({
      name: model.name,
      n: model.n,
      effectiveN: model.effectiveN,
      covariance: model.method,
      mcdSeed: model.mcd?.seed ?? null,
      sizeStatus: fit.sizes[k].status,
      sizeMessages: fit.sizes[k].messages,
      chiSquareFalseRejectionRate: fit.sizes[k].chiSquareFalseRejectionRate,
    })),
    ...extra,
  };
}

export function writeManifest(dir: string, manifest: object): void {
  writeFileSync(join(dir, 'run.json'), JSON.stringify(manifest, null, 2) + '\n');
}

import type { EntityManager } from 'typeorm';
import type { RunSample } from '@provenote/shared';
import { rowSlices } from './insert-assignments';

/**
 * Stores one role's samples as the run's input snapshot, a slice of rows per statement, each column as
 * one array (values flat, cut per row by slicing). Datasets can later fill run_inputs the same way
 * straight from their own tables with INSERT … SELECT.
 */
export async function writeRunInputs(
  manager: EntityManager,
  runId: string,
  role: 'reference' | 'unknown',
  samples: RunSample[],
  p: number,
): Promise<void> {
  for (const [from, to] of rowSlices(samples.length)) {
    const slice = samples.slice(from, to);
    await manager.query(
      `INSERT INTO run_inputs (run_id, role, ordinal, sample_id, group_label, values, below_detection)
       SELECT $1, $2, $3::int + t.k - 1, t.sample_id, t.group_label,
         ($6::float8[])[(t.k - 1) * $8::int + 1 : t.k * $8::int],
         ($7::boolean[])[(t.k - 1) * $8::int + 1 : t.k * $8::int]
       FROM unnest($4::text[], $5::text[]) WITH ORDINALITY AS t(sample_id, group_label, k)`,
      [
        runId,
        role,
        from,
        slice.map((s) => s.sampleId),
        slice.map((s) => s.group ?? null),
        // Literals joined here rather than arrays for pg to escape element by element (see float8Literal).
        `{${slice.map((s) => s.values.join(',')).join(',')}}`,
        `{${slice.map((s) => (s.belowDetection ?? new Array<boolean>(p).fill(false)).join(',')).join(',')}}`,
        p,
      ],
    );
  }
}

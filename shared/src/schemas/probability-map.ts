import { z } from 'zod';
import { assignmentVerdictSchema } from './runs';

/** A heat map has room for about this many rows; a larger run is drawn by evenly spaced rows. */
export const PROBABILITY_MAP_ROW_LIMIT = 400;

/**
 * GET /api/labs/:labId/runs/:runId/probability-map — every unknown of an assign run, ordered by best
 * group (the run's group order), then by falling probability; when there are more than the limit, every
 * `stride`-th row of that order, so each drawn row is a real sample and every group keeps its share.
 */
export const probabilityMapSchema = z.object({
  runId: z.uuid(),
  groups: z.array(z.string()),
  /** Unknowns in the run. */
  total: z.number().int(),
  /** 1 when every unknown is drawn; k when every k-th of the order is. */
  stride: z.number().int().min(1),
  rows: z.array(
    z.object({
      sampleId: z.string(),
      group: z.string(),
      verdict: assignmentVerdictSchema,
      pChi2: z.array(z.number()),
      pHotelling: z.array(z.number()),
    }),
  ),
});
export type ProbabilityMap = z.infer<typeof probabilityMapSchema>;

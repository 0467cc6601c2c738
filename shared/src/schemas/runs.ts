import { z } from 'zod';

/** What a run computes; each kind is one job name on the run queue. */
export const runKinds = ['classify', 'group-check', 'robust-fit', 'bundle'] as const;
export const runKindSchema = z.enum(runKinds);
export type RunKind = z.infer<typeof runKindSchema>;

/** queued → running → succeeded | failed | cancelled; a retry after a failed attempt goes back to queued. */
export const runStatuses = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export const runStatusSchema = z.enum(runStatuses);
export type RunStatus = z.infer<typeof runStatusSchema>;

export const finishedRunStatuses: readonly RunStatus[] = ['succeeded', 'failed', 'cancelled'];
export const isFinishedRunStatus = (status: RunStatus) => finishedRunStatuses.includes(status);

/** How the data are prepared and judged; one schema for the Prepare card's form and the API. */
export const assignmentParametersSchema = z
  .object({
    elements: z.array(z.string().min(1)).min(1, 'choose at least one element'),
    transform: z.enum(['none', 'log10', 'ln', 'alr', 'clr', 'ilr']).default('none'),
    alrDenominator: z.string().min(1).optional(),
    belowDetection: z.enum(['dl-half', 'dl-sqrt2', 'multiplicative']).default('dl-half'),
    covariance: z.enum(['classic', 'mcd']).default('classic'),
    probability: z.enum(['chi2', 'hotelling']).default('chi2'),
    alpha: z.number().gt(0).max(0.5).default(0.05),
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 31 - 1)
      .optional(),
  })
  .refine((p) => new Set(p.elements).size === p.elements.length, {
    message: 'each element may be chosen once',
    path: ['elements'],
  })
  .refine((p) => p.transform !== 'alr' || !p.alrDenominator || p.elements.includes(p.alrDenominator), {
    message: 'the alr denominator must be one of the chosen elements',
    path: ['alrDenominator'],
  });
export type AssignmentParameters = z.infer<typeof assignmentParametersSchema>;

/**
 * One sample of a run's input snapshot: values in the order of `parameters.elements`. A value reported
 * below the detection limit carries the limit as its value and `true` in `belowDetection`.
 */
export const runSampleSchema = z.object({
  sampleId: z.string().min(1),
  group: z.string().min(1).optional(),
  values: z.array(z.number().finite()),
  belowDetection: z.array(z.boolean()).optional(),
});
export type RunSample = z.infer<typeof runSampleSchema>;

const referenceSampleSchema = runSampleSchema.required({ group: true });

const sampleShapeCheck = (
  parameters: AssignmentParameters,
  sets: { name: string; samples: RunSample[] }[],
  ctx: z.RefinementCtx,
) => {
  const p = parameters.elements.length;
  for (const { name, samples } of sets) {
    const bad = samples.findIndex(
      (s) => s.values.length !== p || (s.belowDetection !== undefined && s.belowDetection.length !== p),
    );
    if (bad >= 0) {
      ctx.addIssue({
        code: 'custom',
        path: [name, bad, 'values'],
        message: `sample "${samples[bad].sampleId}" needs exactly ${p} values, one per chosen element`,
      });
    }
  }
};

const classifyRunRequestSchema = z
  .object({
    kind: z.literal('classify'),
    studyId: z.uuid().optional(),
    parameters: assignmentParametersSchema,
    reference: z.array(referenceSampleSchema).min(1),
    unknowns: z.array(runSampleSchema).min(1),
  })
  .superRefine((r, ctx) =>
    sampleShapeCheck(
      r.parameters,
      [
        { name: 'reference', samples: r.reference },
        { name: 'unknowns', samples: r.unknowns },
      ],
      ctx,
    ),
  );

const groupCheckRunRequestSchema = z
  .object({
    kind: z.literal('group-check'),
    studyId: z.uuid().optional(),
    parameters: assignmentParametersSchema,
    reference: z.array(referenceSampleSchema).min(1),
  })
  .superRefine((r, ctx) => sampleShapeCheck(r.parameters, [{ name: 'reference', samples: r.reference }], ctx));

/** POST /api/labs/:labId/runs — the inputs travel with the request and are kept as the run's snapshot. */
export const createRunRequestSchema = z.discriminatedUnion('kind', [
  classifyRunRequestSchema,
  groupCheckRunRequestSchema,
]);
export type CreateRunRequest = z.infer<typeof createRunRequestSchema>;

/** GET /api/labs/:labId/runs/:runId */
export const runSchema = z.object({
  id: z.uuid(),
  labId: z.uuid(),
  studyId: z.uuid().nullable(),
  kind: runKindSchema,
  status: runStatusSchema,
  progress: z.number().min(0).max(1),
  phase: z.string(),
  error: z.string().nullable(),
  parameters: z.record(z.string(), z.unknown()),
  seed: z.number().int().nullable(),
  attempt: z.number().int().min(0),
  createdBy: z.uuid().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
  startedAt: z.iso.datetime({ offset: true }).nullable(),
  finishedAt: z.iso.datetime({ offset: true }).nullable(),
});
export type Run = z.infer<typeof runSchema>;

/** GET /api/labs/:labId/runs — newest first. */
export const runListSchema = z.object({ runs: z.array(runSchema) });
export type RunList = z.infer<typeof runListSchema>;

/** assigned: exactly one group reaches α; ambiguous: two or more do; unassigned: none does. */
export const assignmentVerdicts = ['assigned', 'ambiguous', 'unassigned'] as const;
export const assignmentVerdictSchema = z.enum(assignmentVerdicts);
export type AssignmentVerdict = z.infer<typeof assignmentVerdictSchema>;

export const RESULTS_PAGE_SIZE = 50;

export const assignmentSortKeys = [
  'input',
  'sampleId',
  'verdict',
  'group',
  'probability',
  'runnerUpProbability',
] as const;

/** GET /api/labs/:labId/runs/:runId/assignments — query string. */
export const assignmentsQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  /** Rows per page; the Assign card asks for fewer than the default, the heat map shows the same page. */
  pageSize: z.coerce.number().int().min(1).max(200).default(RESULTS_PAGE_SIZE),
  sort: z.enum(assignmentSortKeys).default('input'),
  order: z.enum(['asc', 'desc']).default('asc'),
  verdict: assignmentVerdictSchema.optional(),
  /** The verdict after the analyst's override, where there is one; the computed verdict otherwise. */
  finalVerdict: assignmentVerdictSchema.optional(),
  group: z.string().min(1).optional(),
  /** Sample ids starting with this text. */
  search: z.string().min(1).max(200).optional(),
});
export type AssignmentsQuery = z.infer<typeof assignmentsQuerySchema>;

/** One unknown: its verdict, best and runner-up groups, and D² and both probabilities per group. */
export const assignmentRowSchema = z.object({
  sampleId: z.string(),
  verdict: assignmentVerdictSchema,
  group: z.string(),
  probability: z.number(),
  runnerUp: z.string().nullable(),
  runnerUpProbability: z.number().nullable(),
  /** Per group, in the order of the page's `groups`. */
  d2: z.array(z.number()),
  pChi2: z.array(z.number()),
  pHotelling: z.array(z.number()),
  /** Per element (transformed coordinates), the share of D² to the best group. */
  contributions: z.array(z.number()),
  /** The analyst's final verdict for this unknown, when it overrides the computed one. */
  override: z.object({ verdict: assignmentVerdictSchema, group: z.string().nullable(), reason: z.string() }).nullable(),
});
export type AssignmentRow = z.infer<typeof assignmentRowSchema>;

export const runGroupSchema = z.object({ name: z.string(), n: z.number().int(), effectiveN: z.number().int() });

export const assignmentsPageSchema = z.object({
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  groups: z.array(runGroupSchema),
  variables: z.array(z.string()),
  rows: z.array(assignmentRowSchema),
});
export type AssignmentsPage = z.infer<typeof assignmentsPageSchema>;

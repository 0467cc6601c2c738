import { z } from 'zod';
import { stepKeySchema, stepStatusSchema, type StepKey } from './notebook';
import { assignmentVerdictSchema as verdictSchema } from './runs';

const reasonSchema = z
  .string()
  .trim()
  .min(10, { error: 'Write at least 10 characters: say why, for whoever reads the record later' })
  .max(2000, { error: 'Use at most 2000 characters' });

export const studyNameSchema = z
  .string()
  .trim()
  .min(1, { error: 'Give the study a name' })
  .max(200, { error: 'Use at most 200 characters' });

export const studyDescriptionSchema = z.string().trim().max(5000, { error: 'Use at most 5000 characters' });

/** Data card: the pinned dataset versions (never "the latest"), so a study reads the same data forever. */
export const dataStepParametersSchema = z.object({
  referenceVersionId: z.uuid({ error: 'Choose a version of a reference dataset' }),
  /** May wait until the groups are checked; the Assign card needs it. */
  unknownsVersionId: z.uuid({ error: 'Choose a version of an unknowns dataset' }).nullable(),
});

/** Prepare card: how the measurements become the coordinates distances are computed in. */
export const prepareStepParametersSchema = z
  .object({
    elements: z.array(z.string().min(1)).min(2, { error: 'Choose at least two elements' }),
    transform: z.enum(['none', 'log10', 'ln', 'alr', 'clr', 'ilr']),
    alrDenominator: z.string().min(1).nullable(),
    belowDetection: z.enum(['dl-half', 'dl-sqrt2', 'multiplicative']),
    covariance: z.enum(['classic', 'mcd']),
    seed: z
      .number()
      .int()
      .min(0)
      .max(2 ** 31 - 1),
  })
  .refine((p) => new Set(p.elements).size === p.elements.length, {
    error: 'Each element may be chosen once',
    path: ['elements'],
  })
  .refine((p) => p.transform !== 'alr' || (p.alrDenominator !== null && p.elements.includes(p.alrDenominator)), {
    error: 'Choose the alr denominator among the chosen elements',
    path: ['alrDenominator'],
  });

/** Reference groups card: which group versions the study assigns against. */
export const groupsStepParametersSchema = z.object({
  groupVersionIds: z.array(z.uuid()).min(2, { error: 'Choose at least two reference groups' }),
});

export const memberExclusionSchema = z.object({
  sampleId: z.string().min(1),
  group: z.string().min(1),
  reason: reasonSchema,
});
export type MemberExclusion = z.infer<typeof memberExclusionSchema>;

/** Group check card: members left out of their group, each with the reason kept in the record. */
export const checkStepParametersSchema = z.object({
  exclusions: z
    .array(memberExclusionSchema)
    .refine((list) => new Set(list.map((e) => `${e.group}\u0000${e.sampleId}`)).size === list.length, {
      error: 'A member can be excluded once',
    }),
});

/** Assign card: the probability a verdict is judged on and the level α. */
export const assignStepParametersSchema = z.object({
  probability: z.enum(['chi2', 'hotelling']),
  alpha: z.number().gt(0, { error: 'α must be above 0' }).max(0.5, { error: 'α must be at most 0.5' }),
});

export const emptyStepParametersSchema = z.object({}).strict();

export const stepParametersSchemas = {
  data: dataStepParametersSchema,
  prepare: prepareStepParametersSchema,
  groups: groupsStepParametersSchema,
  check: checkStepParametersSchema,
  assign: assignStepParametersSchema,
  review: emptyStepParametersSchema,
  export: emptyStepParametersSchema,
} as const satisfies Record<StepKey, z.ZodType>;

export type StepParameters = { [K in StepKey]: z.infer<(typeof stepParametersSchemas)[K]> };

/** What a new study's cards start from; data and groups must be chosen before anything can run. */
export const defaultStepParameters: { [K in StepKey]: StepParameters[K] | null } = {
  data: null,
  prepare: null,
  groups: null,
  check: { exclusions: [] },
  assign: { probability: 'hotelling', alpha: 0.05 },
  review: {},
  export: {},
};

export const stepSchema = z.object({
  key: stepKeySchema,
  status: stepStatusSchema,
  /** Null until the card's settings are first saved. */
  parameters: z.record(z.string(), z.unknown()).nullable(),
  runId: z.uuid().nullable(),
  error: z.string().nullable(),
  updatedAt: z.iso.datetime({ offset: true }),
  updatedBy: z.string().nullable(),
});
export type Step = z.infer<typeof stepSchema>;

/** Overall state shown in the study list. */
export const studyStatuses = ['draft', 'in_progress', 'needs_rerun', 'ready_for_review', 'signed_off'] as const;
export const studyStatusSchema = z.enum(studyStatuses);
export type StudyStatus = z.infer<typeof studyStatusSchema>;

export const studyStatusLabels: Record<StudyStatus, string> = {
  draft: 'Draft',
  in_progress: 'In progress',
  needs_rerun: 'Needs re-run',
  ready_for_review: 'Ready for review',
  signed_off: 'Signed off',
};

export const studySummarySchema = z.object({
  id: z.uuid(),
  labId: z.uuid(),
  name: z.string(),
  description: z.string(),
  status: studyStatusSchema,
  owner: z.object({ id: z.uuid(), displayName: z.string() }).nullable(),
  copiedFromId: z.uuid().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
  updatedAt: z.iso.datetime({ offset: true }),
  signedOffAt: z.iso.datetime({ offset: true }).nullable(),
  signedOffBy: z.string().nullable(),
});
export type StudySummary = z.infer<typeof studySummarySchema>;

/** GET /api/labs/:labId/studies — most recently changed first. */
export const studyListSchema = z.object({ studies: z.array(studySummarySchema) });
export type StudyList = z.infer<typeof studyListSchema>;

/** GET /api/labs/:labId/studies/:studyId */
export const studySchema = studySummarySchema.extend({ steps: z.array(stepSchema) });
export type Study = z.infer<typeof studySchema>;

/** POST /api/labs/:labId/studies */
export const createStudySchema = z.object({ name: studyNameSchema, description: studyDescriptionSchema.default('') });
export type CreateStudy = z.infer<typeof createStudySchema>;

/** PATCH /api/labs/:labId/studies/:studyId */
export const updateStudySchema = z
  .object({ name: studyNameSchema.optional(), description: studyDescriptionSchema.optional() })
  .refine((u) => u.name !== undefined || u.description !== undefined, { error: 'Change the name or description' });
export type UpdateStudy = z.infer<typeof updateStudySchema>;

/** POST /api/labs/:labId/studies/:studyId/copy — the same settings on other data; nothing computed is copied. */
export const copyStudySchema = z.object({
  name: studyNameSchema,
  data: dataStepParametersSchema,
});
export type CopyStudy = z.infer<typeof copyStudySchema>;

/** PUT /api/labs/:labId/studies/:studyId/steps/:stepKey — the card's settings, checked per card. */
export const updateStepSchema = z.object({ parameters: z.record(z.string(), z.unknown()) });
export type UpdateStep = z.infer<typeof updateStepSchema>;

/** The answer to saving a card: the study as it is now and the cards the change made stale. */
export const stepEditResultSchema = z.object({ study: studySchema, staleSteps: z.array(stepKeySchema) });
export type StepEditResult = z.infer<typeof stepEditResultSchema>;

/** POST /api/labs/:labId/studies/:studyId/overrides — an analyst's final verdict beside the computed one. */
export const createOverrideSchema = z
  .object({
    sampleId: z.string().min(1),
    verdict: verdictSchema,
    group: z.string().min(1).nullable(),
    reason: reasonSchema,
  })
  .refine((o) => (o.verdict === 'unassigned') === (o.group === null), {
    error: 'An assigned or ambiguous verdict names a group; an unassigned one does not',
    path: ['group'],
  });
export type CreateOverride = z.infer<typeof createOverrideSchema>;

export const overrideSchema = z.object({
  id: z.uuid(),
  runId: z.uuid(),
  sampleId: z.string(),
  computedVerdict: verdictSchema,
  computedGroup: z.string().nullable(),
  verdict: verdictSchema,
  group: z.string().nullable(),
  reason: z.string(),
  createdBy: z.string().nullable(),
  createdAt: z.iso.datetime({ offset: true }),
});
export type Override = z.infer<typeof overrideSchema>;

export const overrideListSchema = z.object({ overrides: z.array(overrideSchema) });

/** POST /api/labs/:labId/studies/:studyId/sign-off */
export const signOffSchema = z.object({
  statement: z.string().trim().max(2000).default(''),
});
export type SignOff = z.infer<typeof signOffSchema>;

/** GET /api/labs/:labId/studies/:studyId/group-sizes — n against p for the chosen groups (engine's assessment). */
export const groupSizesSchema = z.object({
  p: z.number().int(),
  alpha: z.number(),
  groups: z.array(
    z.object({
      group: z.string(),
      n: z.number().int(),
      p: z.number().int(),
      status: z.enum(['ok', 'warning', 'error']),
      messages: z.array(z.string()),
      chiSquareFalseRejectionRate: z.number().nullable(),
      chiSquareOverRejects: z.boolean(),
    }),
  ),
});
export type GroupSizes = z.infer<typeof groupSizesSchema>;

/**
 * GET /api/labs/:labId/studies/:studyId/element-summary — per measured element of the reference data:
 * how many samples have a number, the share measured above the detection limit, and the median and
 * quartiles (ppm) of the measured values (values reported below the limit are left out of them).
 */
export const elementSummarySchema = z.object({
  datasetVersionId: z.uuid(),
  samples: z.number().int(),
  elements: z.array(
    z.object({
      element: z.string(),
      withValue: z.number().int(),
      fractionDetected: z.number().min(0).max(1),
      median: z.number().nullable(),
      q1: z.number().nullable(),
      q3: z.number().nullable(),
    }),
  ),
  /**
   * Kruskal–Wallis screening of each element's measured values between the groups named in the reference
   * data's group column (rank-based, so the same under log10 or ln). An element it cannot be computed for
   * (fewer than two groups with a measured value, or all values equal) is listed with the reason instead.
   */
  screening: z.object({
    groups: z.array(z.string()),
    elements: z.array(
      z.union([
        z.object({ element: z.string(), h: z.number(), df: z.number().int(), p: z.number().min(0).max(1) }),
        z.object({ element: z.string(), reason: z.string() }),
      ]),
    ),
  }),
});
export type ElementSummary = z.infer<typeof elementSummarySchema>;

/**
 * GET /api/labs/:labId/studies/:studyId/scatter — query string: the space and two of its coordinates.
 * "prepared": the coordinates after the Prepare card's below-detection rule and transform, named as the
 * engine names them (e.g. "clr(Zr)", "pivot(Zr)", "ln(Zr/Nb)"); "measured": the stored ppm of two elements.
 * Without x and y the first two coordinates of the space are drawn.
 */
export const scatterQuerySchema = z.object({
  space: z.enum(['prepared', 'measured']).default('prepared'),
  x: z.string().min(1).optional(),
  y: z.string().min(1).optional(),
});
export type ScatterQuery = z.infer<typeof scatterQuerySchema>;

/** At most this many unknowns are sent for a scatter plot; more would not be readable as points. */
export const SCATTER_UNKNOWNS_LIMIT = 20_000;

const scatterPointSchema = z.object({
  sampleId: z.string(),
  x: z.number(),
  y: z.number(),
  /** A value the point depends on is a detection limit, not a measurement (replaced, in the prepared space). */
  belowDetection: z.boolean(),
});

/** Two coordinates of the reference members by group and of the unknowns with their verdicts. */
export const scatterSchema = z.object({
  space: z.enum(['prepared', 'measured']),
  /** Every coordinate of the space, in the engine's order: what x and y may be. */
  variables: z.array(z.string()),
  x: z.string(),
  y: z.string(),
  reference: z.array(scatterPointSchema.extend({ group: z.string() })),
  unknowns: z.array(
    scatterPointSchema.extend({
      verdict: verdictSchema.nullable(),
      group: z.string().nullable(),
    }),
  ),
  /** The unknowns were cut at SCATTER_UNKNOWNS_LIMIT (in file order). */
  truncated: z.boolean(),
});
export type Scatter = z.infer<typeof scatterSchema>;

import type { Dataset, ReferenceGroup, StepKey, StepStatus, Study } from '@provenote/shared/schemas';

export const LAB = '11111111-1111-4111-8111-111111111111';
export const STUDY = '22222222-2222-4222-8222-222222222222';
export const REFERENCE_VERSION = '33333333-3333-4333-8333-333333333333';
export const CHECK_RUN = '44444444-4444-4444-8444-444444444444';
export const ASSIGN_RUN = '55555555-5555-4555-8555-555555555555';
const AT = '2025-05-01T10:00:00.000Z';

const parameters: Record<StepKey, object | null> = {
  data: { referenceVersionId: REFERENCE_VERSION, unknownsVersionId: null },
  prepare: {
    elements: ['Zr', 'Nb'],
    transform: 'ln',
    alrDenominator: null,
    belowDetection: 'dl-half',
    covariance: 'classic',
    seed: 1,
  },
  groups: { groupVersionIds: [] },
  check: { exclusions: [] },
  assign: { probability: 'hotelling', alpha: 0.05 },
  review: {},
  export: {},
};

/** A synthetic study whose cards have the given statuses, top to bottom. */
export function study(statuses: StepStatus[], overrides: Partial<Study> = {}): Study {
  const keys = Object.keys(parameters) as StepKey[];
  return {
    id: STUDY,
    labId: LAB,
    name: 'Synthetic reservoir core',
    description: 'Invented data',
    status: 'ready_for_review',
    owner: { id: '66666666-6666-4666-8666-666666666666', displayName: 'Ada Analyst' },
    copiedFromId: null,
    createdAt: AT,
    updatedAt: AT,
    signedOffAt: null,
    signedOffBy: null,
    steps: keys.map((key, i) => ({
      key,
      status: statuses[i],
      parameters: parameters[key] as Record<string, unknown> | null,
      runId: key === 'check' ? CHECK_RUN : key === 'assign' ? ASSIGN_RUN : null,
      error: null,
      updatedAt: AT,
      updatedBy: 'Ada Analyst',
    })),
    ...overrides,
  };
}

export const referenceDataset: Dataset = {
  id: '77777777-7777-4777-8777-777777777777',
  labId: LAB,
  name: 'Synthetic soils',
  kind: 'reference',
  createdAt: AT,
  versions: [
    {
      id: REFERENCE_VERSION,
      datasetId: '77777777-7777-4777-8777-777777777777',
      number: 1,
      note: '',
      file: {
        id: '88888888-8888-4888-8888-888888888888',
        filename: 'soils.csv',
        sizeBytes: 10,
        sha256: 'x',
        format: 'csv',
      },
      mapping: {
        options: { delimiter: ',', decimalSeparator: '.', encoding: 'utf-8', unitsRow: false, sheet: null },
        columns: [{ index: 0, header: 'Sample', role: 'sample_id', element: null, unit: null, oxide: null }],
      },
      columns: ['Zr', 'Nb', 'La'].map((element, index) => ({
        index: index + 2,
        header: `${element} ppm`,
        element,
        unit: 'ppm' as const,
        oxide: null,
        factorToPpm: 1,
      })),
      summary: { rowsRead: 8, imported: 8, flagged: 0, rejected: 0, blankRowsSkipped: 0 },
      createdAt: AT,
      createdBy: null,
    },
  ],
};

/** The North ridge group, one column-built version of three members, approved or not. */
export const northRidge = (approved: boolean): ReferenceGroup => ({
  id: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa',
  labId: LAB,
  name: 'North ridge',
  description: 'Synthetic granite outcrops',
  createdAt: '2025-05-01T10:00:00.000Z',
  versions: [
    {
      id: 'bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb',
      groupId: 'aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa',
      number: 1,
      datasetVersionId: REFERENCE_VERSION,
      source: 'column',
      memberIds: ['N1', 'N2', 'N3'],
      note: '',
      createdAt: '2025-05-01T10:00:00.000Z',
      createdBy: 'Ada Analyst',
      approvedAt: approved ? '2025-05-01T11:00:00.000Z' : null,
      approvedBy: approved ? 'Ada Analyst' : null,
    },
  ],
});

export const groupSizes = {
  p: 1,
  alpha: 0.05,
  groups: [
    {
      group: 'North ridge',
      n: 4,
      p: 1,
      status: 'warning',
      messages: ['n = 4 is below 5·p = 5'],
      chiSquareFalseRejectionRate: 0.1234,
      chiSquareOverRejects: true,
    },
  ],
};

export const checkResults = {
  runId: CHECK_RUN,
  groups: [
    { name: 'North ridge', n: 4, effectiveN: 4 },
    { name: 'South fan', n: 4, effectiveN: 4 },
  ],
  variables: ['ln(Zr)'],
  confusion: {
    'North ridge': { 'North ridge': 3, 'South fan': 0, ambiguous: 1, unassigned: 0 },
    'South fan': { 'North ridge': 0, 'South fan': 4, ambiguous: 0, unassigned: 0 },
  },
  returnedToOwnGroup: 7,
  memberCount: 8,
  kruskalWallis: [{ variable: 'ln(Zr)', h: 5.3, df: 1, p: 0.021 }],
  pairs: [{ groupA: 'North ridge', groupB: 'South fan', t2: 12.5, f: 10.4, df1: 1, df2: 6, p: 0.018 }],
  members: {
    total: 1,
    page: 1,
    pageSize: 50,
    rows: [
      {
        sampleId: 'N2',
        group: 'North ridge',
        d2: 1.2,
        d2LeaveOneOut: 2.4,
        pChi2LeaveOneOut: 0.12,
        pHotellingLeaveOneOut: 0.2,
        outcome: 'ambiguous',
        bestGroup: 'North ridge',
      },
    ],
  },
};

export const assignmentsPage = {
  total: 1,
  page: 1,
  pageSize: 50,
  groups: checkResults.groups,
  variables: ['ln(Zr)'],
  rows: [
    {
      sampleId: 'U7',
      verdict: 'assigned',
      group: 'South fan',
      probability: 0.41,
      runnerUp: 'North ridge',
      runnerUpProbability: 0.002,
      d2: [9.1, 0.8],
      pChi2: [0.002, 0.37],
      pHotelling: [0.002, 0.41],
      contributions: [0.8],
      override: null,
    },
  ],
};

export const elementSummary = {
  datasetVersionId: REFERENCE_VERSION,
  samples: 8,
  elements: [
    { element: 'Zr', withValue: 8, fractionDetected: 1, median: 150, q1: 96, q3: 210 },
    { element: 'Nb', withValue: 8, fractionDetected: 0.75, median: 14.2, q1: 12.1, q3: 24.5 },
  ],
  screening: {
    groups: ['North ridge', 'South fan'],
    elements: [
      { element: 'Zr', h: 5.33, df: 1, p: 0.021 },
      { element: 'Nb', reason: 'measured in fewer than two groups' },
    ],
  },
};

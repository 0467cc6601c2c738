import { mulberry32, type CreateRunRequest, type RunSample } from '@provenote/shared';

/**
 * Synthetic reference groups and unknowns for queue tests (an invented scenario: three clay sources
 * measured on three elements, in ppm). Seeded, so every run of a test sees the same numbers.
 */
const SOURCES = [
  { name: 'north-pit', mean: [120, 45, 3.2], sd: [8, 4, 0.3] },
  { name: 'river-terrace', mean: [95, 60, 2.1], sd: [7, 5, 0.25] },
  { name: 'upland', mean: [140, 30, 4.0], sd: [9, 3, 0.35] },
];
export const FIXTURE_ELEMENTS = ['Zr', 'Rb', 'Hf'];

export function syntheticSamples(count: number, seed: number, prefix: string, withGroups: boolean): RunSample[] {
  const random = mulberry32(seed);
  return Array.from({ length: count }, (_, i) => {
    const source = SOURCES[i % SOURCES.length];
    return {
      sampleId: `${prefix}-${String(i + 1).padStart(6, '0')}`,
      ...(withGroups ? { group: source.name } : {}),
      values: source.mean.map((mean, j) => mean + source.sd[j] * random.normal()),
    };
  });
}

export function classifyRequest(unknowns: number, overrides: Partial<CreateRunRequest['parameters']> = {}) {
  return {
    kind: 'classify' as const,
    parameters: {
      elements: FIXTURE_ELEMENTS,
      transform: 'ln' as const,
      belowDetection: 'dl-half' as const,
      covariance: 'classic' as const,
      probability: 'hotelling' as const,
      alpha: 0.05,
      ...overrides,
    },
    reference: syntheticSamples(60, 11, 'ref', true) as (RunSample & { group: string })[],
    unknowns: syntheticSamples(unknowns, 23, 'unk', false),
  };
}

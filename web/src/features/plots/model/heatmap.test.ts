import { describe, expect, it } from 'vitest';
import type { AssignmentsPage } from '@provenote/shared/schemas';
import { heatmapTrace } from './heatmap';

const page: AssignmentsPage = {
  total: 2,
  page: 1,
  pageSize: 50,
  groups: [
    { name: 'North', n: 20, effectiveN: 20 },
    { name: 'South', n: 18, effectiveN: 18 },
  ],
  variables: ['ln(Zr)'],
  rows: [
    {
      sampleId: 'U1',
      verdict: 'assigned',
      group: 'North',
      probability: 0.6,
      runnerUp: 'South',
      runnerUpProbability: 0.01,
      d2: [1, 9],
      pChi2: [0.55, 0.02],
      pHotelling: [0.6, 0.01],
      contributions: [1],
    },
    {
      sampleId: 'U2',
      verdict: 'unassigned',
      group: 'South',
      probability: 0.03,
      runnerUp: 'North',
      runnerUpProbability: 0.001,
      d2: [12, 7],
      pChi2: [0.002, 0.04],
      pHotelling: [0.001, 0.03],
      contributions: [7],
    },
  ],
};

describe('heatmapTrace', () => {
  it('lays out unknowns by groups with the probabilities of the chosen basis, as the run gave them', () => {
    const trace = heatmapTrace(page, 'hotelling');
    expect(trace.x).toEqual(['North', 'South']);
    expect(trace.y).toEqual(['U1', 'U2']);
    expect(trace.z).toEqual([
      [0.6, 0.01],
      [0.001, 0.03],
    ]);
    expect(heatmapTrace(page, 'chi2').z[1]).toEqual([0.002, 0.04]);
  });

  it('keeps the colour scale on 0–1 so pages compare', () => {
    expect(heatmapTrace(page, 'chi2')).toMatchObject({ zmin: 0, zmax: 1 });
  });
});

import { describe, expect, it } from 'vitest';
import type { ProbabilityMap } from '@provenote/shared/schemas';
import { heatmapHeight, heatmapLayout, heatmapTrace } from './heatmap';

const map: ProbabilityMap = {
  runId: '7b0a3c52-1d4e-4f6a-9b2c-3e5d7f9a1b2c',
  groups: ['North', 'South'],
  total: 2,
  stride: 1,
  rows: [
    { sampleId: 'U1', group: 'North', verdict: 'assigned', pChi2: [0.55, 0.02], pHotelling: [0.6, 0.01] },
    { sampleId: 'U2', group: 'South', verdict: 'unassigned', pChi2: [0.001, 0.03], pHotelling: [0.0005, 0.04] },
  ],
};

describe('heatmapTrace', () => {
  it('draws the chosen basis, a row per unknown and a column per group', () => {
    const trace = heatmapTrace(map, 'hotelling');
    expect(trace.x).toEqual(['North', 'South']);
    expect(trace.y).toEqual(['U1', 'U2']);
    expect(trace.z).toEqual([
      [0.6, 0.01],
      [0.0005, 0.04],
    ]);
    expect(heatmapTrace(map, 'chi2').z[1]).toEqual([0.001, 0.03]);
  });

  it('names the sample and its probability for every group on hover', () => {
    const trace = heatmapTrace(map, 'chi2');
    expect(trace.hovertemplate).toContain('Sample %{y}');
    expect(trace.customdata[0]).toEqual(['North: 0.5500<br>South: 0.0200', 'North: 0.5500<br>South: 0.0200']);
  });

  it('hides the sample ids of a long map and keeps it within a screen', () => {
    const long = { ...map, rows: Array.from({ length: 400 }, (_, i) => ({ ...map.rows[0], sampleId: `U${i}` })) };
    expect(heatmapLayout(map).yaxis.showticklabels).toBe(true);
    expect(heatmapLayout(long).yaxis.showticklabels).toBe(false);
    expect(heatmapHeight(long)).toBe(640);
    expect(heatmapHeight(map)).toBe(320);
  });
});

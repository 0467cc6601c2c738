import { describe, expect, it } from 'vitest';
import type { Scatter } from '@provenote/shared/schemas';
import { groupStyle } from './palette';
import { scatterTraces } from './scatter';

const data: Scatter = {
  space: 'measured',
  variables: ['Zr', 'La'],
  x: 'Zr',
  y: 'La',
  reference: [
    { sampleId: 'N1', group: 'North', x: 200, y: 30, belowDetection: false },
    { sampleId: 'S1', group: 'South', x: 90, y: 45, belowDetection: false },
  ],
  unknowns: [
    { sampleId: 'U1', x: 190, y: 31, belowDetection: false, verdict: 'assigned', group: 'North' },
    { sampleId: 'U2', x: 150, y: 38, belowDetection: false, verdict: 'ambiguous', group: 'North' },
    { sampleId: 'U3', x: 400, y: 90, belowDetection: false, verdict: 'unassigned', group: 'South' },
  ],
  truncated: false,
};

describe('scatterTraces', () => {
  const traces = scatterTraces(data, ['North', 'South']);

  it('draws each group in its own colour and shape, with the values as stored', () => {
    const north = traces.find((t) => t.name === 'North')!;
    expect(north.marker).toMatchObject({ color: groupStyle(0).colour, symbol: groupStyle(0).symbol });
    expect([north.x, north.y, north.customdata]).toEqual([[200], [30], ['N1']]);
    expect(traces.find((t) => t.name === 'South')!.marker.symbol).toBe(groupStyle(1).symbol);
  });

  it('overlays the unknowns by verdict, an assigned one in its group’s open shape', () => {
    expect(traces.map((t) => t.name)).toEqual([
      'North',
      'South',
      'Unknown, assigned to North',
      'Unknown, ambiguous',
      'Unknown, unassigned',
    ]);
    expect(traces[2].marker.symbol).toBe(`${groupStyle(0).symbol}-open`);
    expect(traces[4].customdata).toEqual(['U3']);
  });

  it('names the sample and both values on hover', () => {
    expect(traces[0].hovertemplate).toContain('Sample %{customdata}');
    expect(traces[0].hovertemplate).toContain('Zr %{x} ppm');
  });

  it('gives transformed coordinates no unit', () => {
    const clr = scatterTraces({ ...data, space: 'prepared', x: 'clr(Zr)', y: 'clr(La)' }, ['North'], false);
    expect(clr[0].hovertemplate).toContain('clr(Zr) %{x}<br>');
    expect(clr[0].hovertemplate).not.toContain('ppm');
  });
});

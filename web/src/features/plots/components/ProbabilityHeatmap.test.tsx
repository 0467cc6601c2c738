import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ProbabilityMap } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { ProbabilityHeatmap } from './ProbabilityHeatmap';

// jsdom cannot draw Plotly's SVG and canvas layers; this stand-in shows the data the chart receives,
// hands over its element as Plotly's onInitialized does, and reports a click the way Plotly's event does.
const downloadChart = vi.fn();
vi.mock('./PlotlyImpl', () => ({
  default: (props: {
    data: { z: number[][] }[];
    onClick: (e: unknown) => void;
    onInitialized: (figure: unknown, div: HTMLElement) => void;
  }) => (
    <button
      ref={(element) => {
        if (element) props.onInitialized({}, element);
      }}
      onClick={() => props.onClick({ points: [{ x: 'South fan', y: 'U7', curveNumber: 0 }] })}
    >
      {JSON.stringify(props.data[0].z)}
    </button>
  ),
  downloadChart: (...args: unknown[]) => downloadChart(...args),
}));

const LAB = '11111111-1111-4111-8111-111111111111';
const RUN = '7b0a3c52-1d4e-4f6a-9b2c-3e5d7f9a1b2c';
const row = { sampleId: 'U7', group: 'North ridge', verdict: 'assigned' as const, pChi2: [0.37], pHotelling: [0.41] };

function answer(map: Omit<ProbabilityMap, 'runId' | 'groups'>) {
  const requested: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      requested.push(new URL(String(input), 'http://localhost').pathname);
      return Response.json({ runId: RUN, groups: ['North ridge'], ...map });
    }),
  );
  return requested;
}

describe('ProbabilityHeatmap', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('draws the whole run in the chosen basis and opens a clicked sample', async () => {
    const requested = answer({ total: 1, stride: 1, rows: [row] });
    const onOpen = vi.fn();
    render(<ProbabilityHeatmap labId={LAB} runId={RUN} initialBasis="hotelling" onOpenUnknown={onOpen} />);
    const chart = await screen.findByRole('button', { name: '[[0.41]]' });
    expect(requested).toEqual([`/api/labs/${LAB}/runs/${RUN}/probability-map`]);
    expect(screen.getByText(/All 1 unknowns of the run/)).toBeInTheDocument();
    expect(screen.getByText(/statistical evidence of membership, not proof of origin/)).toBeInTheDocument();
    await userEvent.click(chart);
    expect(onOpen).toHaveBeenCalledWith('U7');

    await userEvent.click(screen.getByText('χ²'));
    expect(await screen.findByRole('button', { name: '[[0.37]]' })).toBeInTheDocument();
  });

  it('says when a large run is thinned, and by how much', async () => {
    answer({ total: 100_000, stride: 250, rows: [row] });
    render(<ProbabilityHeatmap labId={LAB} runId={RUN} initialBasis="chi2" onOpenUnknown={vi.fn()} />);
    expect(await screen.findByText(/1 of the run's 100,000 unknowns.*every 250th drawn/)).toBeInTheDocument();
  });

  it('downloads the chart as SVG', async () => {
    answer({ total: 1, stride: 1, rows: [row] });
    render(<ProbabilityHeatmap labId={LAB} runId={RUN} initialBasis="chi2" onOpenUnknown={vi.fn()} />);
    await screen.findByRole('button', { name: '[[0.37]]' });
    await userEvent.click(screen.getByRole('button', { name: 'Download SVG' }));
    expect(downloadChart).toHaveBeenCalledWith(expect.anything(), 'svg', 'membership-probabilities');
  });
});

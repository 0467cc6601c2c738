import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import type { AssignmentsPage } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { assignmentsPage } from '../../notebook/test/notebook-fixtures';
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

const page = assignmentsPage as AssignmentsPage;

describe('ProbabilityHeatmap', () => {
  it('draws the probabilities of the chosen basis and opens a sample on click', async () => {
    const onOpen = vi.fn();
    render(<ProbabilityHeatmap page={page} initialBasis="hotelling" onOpen={onOpen} />);
    const chart = await screen.findByRole('button', { name: '[[0.002,0.41]]' });
    await userEvent.click(chart);
    expect(onOpen).toHaveBeenCalledWith(page.rows[0]);

    await userEvent.click(screen.getByText('χ²'));
    expect(await screen.findByRole('button', { name: '[[0.002,0.37]]' })).toBeInTheDocument();
  });

  it('downloads the chart as SVG', async () => {
    render(<ProbabilityHeatmap page={page} initialBasis="chi2" onOpen={() => undefined} />);
    await screen.findByRole('button', { name: '[[0.002,0.37]]' });
    await userEvent.click(screen.getByRole('button', { name: 'Download SVG' }));
    expect(downloadChart).toHaveBeenCalledWith(expect.anything(), 'svg', 'membership-probabilities');
  });
});

import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Scatter } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { BivariatePlot } from './BivariatePlot';

// jsdom cannot draw Plotly; this stand-in shows the axis titles and types it receives.
vi.mock('./PlotlyImpl', () => ({
  default: (props: {
    layout: { xaxis: { title: { text: string }; type: string }; yaxis: { title: { text: string } } };
  }) => <p>{`${props.layout.xaxis.title.text} | ${props.layout.yaxis.title.text} | ${props.layout.xaxis.type}`}</p>,
  downloadChart: vi.fn(),
}));

const LAB = '11111111-1111-4111-8111-111111111111';
const STUDY = '22222222-2222-4222-8222-222222222222';
const point = { sampleId: 'N1', group: 'North', x: 1, y: 2, belowDetection: false };

/** Answers as the API does: its variables for the space, the first two unless x and y are given. */
function answerScatter(prepared: string[]) {
  const requests: URLSearchParams[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://localhost');
      requests.push(url.searchParams);
      const space = url.searchParams.get('space') as Scatter['space'];
      const variables = space === 'prepared' ? prepared : ['Zr', 'Nb', 'La'];
      const body: Scatter = {
        space,
        variables,
        x: url.searchParams.get('x') ?? variables[0],
        y: url.searchParams.get('y') ?? variables[1],
        reference: [point],
        unknowns: [],
        truncated: false,
      };
      return Response.json(body);
    }),
  );
  return requests;
}

const renderPlot = () =>
  render(
    <BivariatePlot
      labId={LAB}
      studyId={STUDY}
      elements={['Zr', 'Nb', 'La']}
      groupOrder={['North']}
      onOpenUnknown={vi.fn()}
    />,
  );

describe('BivariatePlot', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('plots the prepared coordinates by their transformed names, on linear axes', async () => {
    const requests = answerScatter(['clr(Zr)', 'clr(Nb)', 'clr(La)']);
    renderPlot();
    expect(await screen.findByText('clr(Zr) | clr(Nb) | linear')).toBeInTheDocument();
    expect(requests[0].get('space')).toBe('prepared');
    expect(screen.queryByRole('switch', { name: 'Logarithmic axes' })).not.toBeInTheDocument();
    const vertical = screen.getByRole('combobox', { name: 'Vertical' });
    await userEvent.click(vertical);
    const list = document.getElementById(vertical.getAttribute('aria-controls')!)!;
    await userEvent.click(within(list).getByRole('option', { name: 'clr(La)', hidden: true }));
    expect(await screen.findByText('clr(Zr) | clr(La) | linear')).toBeInTheDocument();
    expect(Object.fromEntries(requests.at(-1)!)).toEqual({ space: 'prepared', x: 'clr(Zr)', y: 'clr(La)' });
  });

  it('offers ppm on log axes when the transform is none, and the measured values on request', async () => {
    const requests = answerScatter(['Zr', 'Nb', 'La']);
    renderPlot();
    expect(await screen.findByText('Zr (ppm) | Nb (ppm) | log')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('switch', { name: 'Logarithmic axes' }));
    expect(await screen.findByText('Zr (ppm) | Nb (ppm) | linear')).toBeInTheDocument();
    await userEvent.click(screen.getByText('As measured (ppm)'));
    await vi.waitFor(() => expect(requests.at(-1)!.get('space')).toBe('measured'));
    expect(await screen.findByText(/Values as measured \(ppm\), not transformed/)).toBeInTheDocument();
  });
});

import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Projection } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { ProjectionPlot } from './ProjectionPlot';

// jsdom cannot draw Plotly; this stand-in lists the traces and axis titles it receives and reports a
// click on the last trace's first point the way Plotly's click event does.
vi.mock('./PlotlyImpl', () => ({
  default: (props: {
    data: { name: string; x: number[]; customdata?: string[] }[];
    layout: { xaxis: { title: { text: string } }; yaxis: { title: { text: string } } };
    onClick: (e: unknown) => void;
  }) => {
    const last = props.data[props.data.length - 1];
    return (
      <div>
        <p>{`${props.layout.xaxis.title.text} | ${props.layout.yaxis.title.text}`}</p>
        <ul>
          {props.data.map((trace) => (
            <li key={trace.name}>{`${trace.name}: ${trace.x.length}`}</li>
          ))}
        </ul>
        <button
          onClick={() =>
            props.onClick({ points: [{ x: last.x[0], y: 0, customdata: last.customdata?.[0], curveNumber: 0 }] })
          }
        >
          click last trace
        </button>
      </div>
    );
  },
  downloadChart: vi.fn(),
}));

const RUN = '7b0a3c52-1d4e-4f6a-9b2c-3e5d7f9a1b2c';
const outline = (r: number) => ({ x: [r, 0, -r, 0, r], y: [0, r, 0, -r, 0] });

/** A small invented projection (synthetic numbers) in the response shape of the API. */
function projection(method: 'pca' | 'cv', level: number): Projection {
  if (method === 'cv') {
    return {
      ...projection('pca', level),
      method: 'cv',
      basis: null,
      unavailable: 'canonical variates of 2 group(s) give at most 1 axis; a plane needs three or more groups',
      axes: [],
      reference: [],
      unknowns: [],
      groups: [],
    };
  }
  return {
    runId: RUN,
    method,
    level,
    unavailable: null,
    basis: 'covariance',
    ellipseBasis: 'f',
    axes: [
      { label: 'PC1', share: 0.724 },
      { label: 'PC2', share: 0.181 },
    ],
    reference: [
      { sampleId: 'N1', group: 'North ridge', x: 1, y: 0.2 },
      { sampleId: 'N2', group: 'North ridge', x: 1.2, y: -0.1 },
      { sampleId: 'S1', group: 'South fan', x: -1, y: 0.3 },
    ],
    unknowns: [
      { sampleId: 'U1', verdict: 'assigned', group: 'North ridge', x: 0.9, y: 0 },
      { sampleId: 'U7', verdict: 'unassigned', group: 'South fan', x: 3, y: 3 },
    ],
    unknownTotal: 2,
    groups: [
      { name: 'North ridge', n: 2, mean: [1.1, 0.05], ellipse: outline(level), ellipseNote: null },
      {
        name: 'South fan',
        n: 1,
        mean: [-1, 0.3],
        ellipse: null,
        ellipseNote: 'group "projected group" has n = 1 members on p = 2 variables',
      },
    ],
  };
}

function stubApi() {
  const urls: string[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://localhost');
      urls.push(`${url.pathname}${url.search}`);
      const method = url.searchParams.get('method') as 'pca' | 'cv';
      const body = projection(method, Number(url.searchParams.get('level')));
      return new Response(JSON.stringify(body), { headers: { 'Content-Type': 'application/json' } });
    }),
  );
  return urls;
}

afterEach(() => vi.unstubAllGlobals());

describe('ProjectionPlot', () => {
  it('draws groups with their ellipses and unknowns by verdict, labels the axes and opens a clicked unknown', async () => {
    const urls = stubApi();
    const onOpen = vi.fn();
    render(
      <ProjectionPlot labId="lab-1" runId={RUN} groupOrder={['North ridge', 'South fan']} onOpenUnknown={onOpen} />,
    );
    expect(await screen.findByText('PC1 (72.4 %) | PC2 (18.1 %)')).toBeInTheDocument();
    expect(urls).toEqual([`/api/labs/lab-1/runs/${RUN}/projection?method=pca&level=0.95`]);
    for (const trace of [
      'North ridge: 2',
      'North ridge, 95 % ellipse: 5',
      'South fan: 1',
      'Unknown, assigned to North ridge: 1',
      'Unknown, unassigned: 1',
    ]) {
      expect(screen.getByText(trace)).toBeInTheDocument();
    }
    expect(screen.queryByText(/South fan, 95 % ellipse/)).not.toBeInTheDocument();
    expect(screen.getByText(/No ellipse for South fan/)).toBeInTheDocument();
    expect(screen.getByText(/F based \(wider for small groups\)/)).toBeInTheDocument();

    await userEvent.click(screen.getByRole('button', { name: 'click last trace' }));
    expect(onOpen).toHaveBeenCalledWith('U7');
  });

  it('asks for the chosen level and method, and says why a method has no plot', async () => {
    const urls = stubApi();
    render(<ProjectionPlot labId="lab-1" runId={RUN} groupOrder={[]} onOpenUnknown={() => undefined} />);
    await screen.findByText('North ridge, 95 % ellipse: 5');
    await userEvent.click(screen.getByText('99 %'));
    expect(await screen.findByText('North ridge, 99 % ellipse: 5')).toBeInTheDocument();
    await userEvent.click(screen.getByText('Canonical variates'));
    expect(await screen.findByText(/a plane needs three or more groups/)).toBeInTheDocument();
    expect(urls).toEqual([
      `/api/labs/lab-1/runs/${RUN}/projection?method=pca&level=0.95`,
      `/api/labs/lab-1/runs/${RUN}/projection?method=pca&level=0.99`,
      `/api/labs/lab-1/runs/${RUN}/projection?method=cv&level=0.99`,
    ]);
  });
});

import { screen, within } from '@testing-library/react';
import type { ElementSummary } from '@provenote/shared/schemas';
import { describe, expect, it } from 'vitest';
import { render } from '../../../test-utils/render';
import { ElementSummaryTable } from './ElementSummaryTable';

const summary: ElementSummary = {
  datasetVersionId: '22222222-2222-4222-8222-222222222222',
  samples: 7,
  elements: [
    { element: 'Zr', withValue: 7, fractionDetected: 6 / 7, median: 153.5, q1: 96.25, q3: 210.75 },
    { element: 'Nb', withValue: 7, fractionDetected: 1, median: 14, q1: 12.5, q3: 24.5 },
    { element: 'U', withValue: 3, fractionDetected: 3 / 7, median: 1.2, q1: 1.1, q3: 1.3 },
  ],
  screening: {
    groups: ['North ridge', 'South fan'],
    elements: [
      { element: 'Zr', h: 3.857143, df: 1, p: 0.049535 },
      { element: 'Nb', h: 4.581818, df: 1, p: 0.000312 },
      { element: 'U', reason: 'measured in fewer than two groups' },
    ],
  },
};

const row = (element: string) => screen.getByRole('cell', { name: element }).closest('tr') as HTMLElement;

describe('ElementSummaryTable', () => {
  it('shows H and p beside each element, and why one could not be screened', () => {
    render(<ElementSummaryTable summary={summary} chosen={['Zr']} />);
    expect(within(row('Zr')).getByText('3.86')).toBeInTheDocument();
    expect(within(row('Zr')).getByText('0.050')).toBeInTheDocument();
    expect(within(row('Nb')).getByText('3.1e-4')).toBeInTheDocument();
    expect(within(row('U')).getByText('not computed: measured in fewer than two groups')).toBeInTheDocument();
    expect(
      screen.getByText(/between the 2 groups of the data's group column \(North ridge, South fan\)/),
    ).toBeInTheDocument();
  });

  it('keeps its header above a scrolling body so a long list does not lengthen the card', () => {
    render(<ElementSummaryTable summary={summary} chosen={[]} />);
    const table = screen.getByRole('table', { name: 'Summary per element' });
    expect(table.querySelector('thead')).toHaveAttribute('data-sticky');
    expect(table.closest('.mantine-ScrollArea-root')).not.toBeNull();
  });

  it('says the screening needs two groups when the data has fewer', () => {
    render(<ElementSummaryTable summary={{ ...summary, screening: { groups: [], elements: [] } }} chosen={[]} />);
    expect(screen.getByText(/needs at least two groups/)).toBeInTheDocument();
  });
});

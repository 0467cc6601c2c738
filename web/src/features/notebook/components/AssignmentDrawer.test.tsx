import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { AssignmentRow } from '@provenote/shared/schemas';
import { render } from '../../../test-utils/render';
import { fakeApi } from '../test/fake-api';
import { assignmentsPage, LAB, STUDY } from '../test/notebook-fixtures';
import { AssignmentDrawer } from './AssignmentDrawer';

// South fan is so far that its χ² tail underflows to an exact 0 in double precision.
const row: AssignmentRow = {
  ...assignmentsPage.rows[0],
  verdict: 'assigned',
  sampleId: 'TR2-031',
  group: 'North ridge',
  probability: 0.37,
  runnerUp: 'South fan',
  runnerUpProbability: 1.234e-7,
  d2: [0.8, 1450.2],
  pChi2: [0.37, 0],
  pHotelling: [0.41, 1.234e-7],
};

describe('AssignmentDrawer', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('states an underflowed probability as a bound and every probability in one format', async () => {
    fakeApi({ [`GET /api/labs/${LAB}/studies/${STUDY}/overrides`]: () => ({ body: { overrides: [] } }) });
    render(
      <AssignmentDrawer
        labId={LAB}
        studyId={STUDY}
        canOverride={false}
        row={row}
        groups={assignmentsPage.groups}
        variables={assignmentsPage.variables}
        onClose={vi.fn()}
      />,
    );
    const table = await screen.findByRole('table', { name: 'Distance and probabilities per group' });
    const south = within(table).getByText('South fan').closest('tr')!;
    expect(within(south).getByText('< 1e-300')).toBeInTheDocument();
    expect(within(south).getByText('1.23e-7')).toBeInTheDocument();
    const north = within(table).getByText('North ridge').closest('tr')!;
    expect(within(north).getByText('0.370')).toBeInTheDocument();
    expect(within(north).getByText('0.410')).toBeInTheDocument();
    expect(screen.queryByText(/0\.00e\+0/)).not.toBeInTheDocument();
    expect(screen.getByText(/best group/)).toHaveTextContent(
      'best group North ridge (0.370), runner-up South fan (1.23e-7).',
    );
  });
});

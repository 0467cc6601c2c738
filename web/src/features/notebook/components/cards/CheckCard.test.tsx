import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { render } from '../../../../test-utils/render';
import { checkResults, LAB, STUDY, study } from '../../test/notebook-fixtures';
import { fakeApi } from '../../test/fake-api';
import { CheckCard } from './CheckCard';

const current = study(['current', 'current', 'current', 'current', 'not_run', 'not_run', 'not_run']);
const check = current.steps.find((s) => s.key === 'check')!;

const withRobustFit = {
  ...checkResults,
  robustFit: [
    { group: 'North ridge', seed: 20240601, cutoff: 5.02, flagged: 1, note: null },
    {
      group: 'South fan',
      seed: 20240601,
      cutoff: null,
      flagged: null,
      note: '3 members is too few for a robust fit with 1 coordinates: it needs at least 4.',
    },
  ],
  members: {
    ...checkResults.members,
    rows: checkResults.members.rows.map((r) => ({ ...r, robustD2: 9.81, flaggedByRobustFit: true })),
  },
};

function renderCard(onSave = vi.fn()) {
  render(
    <CheckCard
      labId={LAB}
      study={current}
      step={{ ...check, status: 'current' }}
      readOnly={false}
      onSave={onSave}
      saving={false}
      errors={{}}
      mayExclude
      runRefusal={null}
      onRun={vi.fn()}
      running={false}
      runBlocked={false}
      memberOptions={[{ value: 'North ridge\u0000N2', label: 'N2 (North ridge)', group: 'North ridge' }]}
    />,
  );
  return onSave;
}

/** 1-based position of a column in the table's header, for picking the same cell in a row. */
const columnIndex = (table: HTMLElement, accessor: string) =>
  [...table.querySelectorAll('thead th')].findIndex((th) => th.getAttribute('data-accessor') === accessor) + 1;

const requestedUrls = () => vi.mocked(fetch).mock.calls.map(([url]) => String(url));

describe('CheckCard: robust fit', () => {
  const setupMatchMedia = window.matchMedia;
  // mantine-datatable renders cells only when its (empty) media query matches; the jsdom stub says false.
  beforeEach(() => {
    window.matchMedia = (query: string) => ({ ...setupMatchMedia(query), matches: query === '' });
    fakeApi({ [`GET /api/labs/${LAB}/studies/${STUDY}/check-results`]: () => ({ body: withRobustFit }) });
  });
  afterEach(() => {
    window.matchMedia = setupMatchMedia;
    vi.unstubAllGlobals();
    vi.restoreAllMocks();
  });

  it('shows the robust D² with a flag, the caution, and why a group has no robust fit', async () => {
    renderCard();
    const table = await screen.findByRole('table', { name: 'Leave-one-out results per member' });
    const row = within(table).getByText('N2').closest('tr')!;
    expect(within(row).getByText('D² 9.81')).toBeInTheDocument();
    expect(within(row).getByText('Flagged')).toBeInTheDocument();
    expect(screen.getByText(/statistical evidence that a member lies apart from its group, not proof/)).toBeVisible();
    expect(screen.getByText(/South fan: 3 members is too few for a robust fit/)).toBeVisible();
  });

  it('keeps ids and numbers on one line and pins the Exclude column at the right edge', async () => {
    // The table places pinned columns from their measured widths, which jsdom reports as 0.
    vi.spyOn(HTMLElement.prototype, 'getBoundingClientRect').mockReturnValue(new DOMRect(0, 0, 120, 30));
    renderCard();
    const table = await screen.findByRole('table', { name: 'Leave-one-out results per member' });
    const row = within(table).getByText('N2').closest('tr')!;
    const cell = (accessor: string) => row.querySelector(`td:nth-child(${columnIndex(table, accessor)})`)!;
    for (const accessor of ['sampleId', 'd2LeaveOneOut', 'pHotellingLeaveOneOut', 'pChi2LeaveOneOut']) {
      expect(cell(accessor)).toHaveClass('mantine-datatable-nowrap');
    }
    const exclude = within(row).getByRole('button', { name: 'Exclude N2 from North ridge' }).closest('td')!;
    await vi.waitFor(() => expect(exclude).toHaveAttribute('data-pinned', 'right'));
    expect(exclude).toHaveClass('mantine-datatable-nowrap');
  });

  it('asks the API for flagged members only when the filter is ticked', async () => {
    renderCard();
    await screen.findByRole('table', { name: 'Leave-one-out results per member' });
    expect(requestedUrls().some((u) => u.includes('flaggedByRobustFit'))).toBe(false);
    await userEvent.click(screen.getByRole('checkbox', { name: /Flagged by robust fit/ }));
    await vi.waitFor(() => expect(requestedUrls().some((u) => u.includes('flaggedByRobustFit=true'))).toBe(true));
  });

  it('excludes a flagged member from its row, with the written reason', async () => {
    const onSave = renderCard();
    await userEvent.click(await screen.findByRole('button', { name: 'Exclude N2 from North ridge' }));
    expect(screen.getByRole('combobox', { name: 'Member to exclude' })).toHaveValue('N2 (North ridge)');
    const reason = screen.getByLabelText('Reason');
    expect(reason).toHaveFocus();
    await userEvent.type(reason, 'Field note 12: collected from a spoil heap');
    await userEvent.click(screen.getByRole('button', { name: 'Exclude member' }));
    expect(onSave).toHaveBeenCalledWith({
      exclusions: [{ sampleId: 'N2', group: 'North ridge', reason: 'Field note 12: collected from a spoil heap' }],
    });
  });
});

import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { render } from '../../../test-utils/render';
import { fakeApi } from '../test/fake-api';
import { assignmentsPage, LAB, STUDY } from '../test/notebook-fixtures';
import { AssignmentsTable } from './AssignmentsTable';

const RUN = '0b7e57a8-4a4c-4d43-9a35-6a2f8d9d1c10';
const reason = 'Thin section shows the South fan feldspar texture';
const page = {
  ...assignmentsPage,
  total: 2,
  rows: [
    assignmentsPage.rows[0],
    {
      ...assignmentsPage.rows[0],
      sampleId: 'TR2-027',
      verdict: 'ambiguous',
      override: { verdict: 'assigned', group: 'South fan', reason },
    },
  ],
};

const requestedUrls = () => vi.mocked(fetch).mock.calls.map(([url]) => new URL(String(url), 'http://localhost'));

describe('AssignmentsTable: final verdicts', () => {
  const setupMatchMedia = window.matchMedia;
  // mantine-datatable renders cells only when its (empty) media query matches; the jsdom stub says false.
  beforeEach(() => {
    window.matchMedia = (query: string) => ({ ...setupMatchMedia(query), matches: query === '' });
    fakeApi({ [`GET /api/labs/${LAB}/runs/${RUN}/assignments`]: () => ({ body: page }) });
  });
  afterEach(() => {
    window.matchMedia = setupMatchMedia;
    vi.unstubAllGlobals();
  });

  const renderTable = () =>
    render(
      <AssignmentsTable labId={LAB} studyId={STUDY} runId={RUN} canOverride={false} basis="chi2" elements={['Zr']} />,
    );

  it('shows the override as the final verdict, marked, with its reason on hover', async () => {
    renderTable();
    const table = await screen.findByRole('table', { name: 'Assignments of the unknowns' });
    const overridden = (await within(table).findByText('TR2-027')).closest('tr')!;
    expect(within(overridden).getByText('ambiguous')).toBeInTheDocument();
    expect(within(overridden).getByText('assigned (South fan)')).toBeInTheDocument();
    const mark = within(overridden).getByText('overridden');
    expect(mark.closest('[title]')).toHaveAttribute('title', `Overridden — reason: ${reason}`);
    const computedOnly = within(table).getByText('U7').closest('tr')!;
    expect(within(computedOnly).getAllByText('assigned')).toHaveLength(2);
    expect(within(computedOnly).queryByText('overridden')).not.toBeInTheDocument();
  });

  it('filters on the final verdict', async () => {
    renderTable();
    await screen.findByRole('table', { name: 'Assignments of the unknowns' });
    const filter = screen.getByRole('combobox', { name: 'Final verdict' });
    await userEvent.click(filter);
    const list = document.getElementById(filter.getAttribute('aria-controls')!)!;
    await userEvent.click(within(list).getByRole('option', { name: 'assigned', hidden: true }));
    await vi.waitFor(() =>
      expect(requestedUrls().some((u) => u.searchParams.get('finalVerdict') === 'assigned')).toBe(true),
    );
    expect(requestedUrls().some((u) => u.searchParams.has('verdict'))).toBe(false);
  });
});

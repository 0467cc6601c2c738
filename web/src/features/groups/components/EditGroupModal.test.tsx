import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { render } from '../../../test-utils/render';
import { fakeApi } from '../../notebook/test/fake-api';
import { LAB, northRidge, REFERENCE_VERSION, referenceDataset } from '../../notebook/test/notebook-fixtures';
import { EditGroupModal } from './EditGroupModal';

const base = `/api/labs/${LAB}`;
const group = northRidge(true);
const rows = ['N1', 'N2', 'N3', 'N4'].map((sampleId, row) => ({
  row,
  sampleId,
  group: 'North ridge',
  cells: [],
  attributes: {},
}));

function answers() {
  return fakeApi({
    'GET /api/auth/csrf': () => ({ body: { csrfToken: 'test-token' } }),
    [`GET ${base}/datasets/${referenceDataset.id}/versions/1/rows`]: () => ({
      body: { page: 1, pageSize: 100, total: rows.length, columns: [], rows },
    }),
    [`PATCH ${base}/groups/${group.id}`]: (body) => ({ body: { ...group, ...(body as object) } }),
    [`POST ${base}/groups/${group.id}/versions`]: () => ({ status: 201, body: group }),
  });
}

const renderModal = (onClose = vi.fn()) => {
  render(<EditGroupModal labId={LAB} group={group} datasets={[referenceDataset]} onClose={onClose} />);
  return onClose;
};

describe('EditGroupModal', () => {
  const setupMatchMedia = window.matchMedia;
  // mantine-datatable renders cells only when its (empty) media query matches; the jsdom stub says false.
  beforeEach(() => {
    window.matchMedia = (query: string) => ({ ...setupMatchMedia(query), matches: query === '' });
  });
  afterEach(() => {
    window.matchMedia = setupMatchMedia;
    vi.unstubAllGlobals();
  });

  it('renames a group, refusing an empty name with a message', async () => {
    const { calls } = answers();
    renderModal();
    const name = screen.getByRole('textbox', { name: 'Name' });
    await userEvent.clear(name);
    await userEvent.click(screen.getByRole('button', { name: 'Save name and description' }));
    expect(screen.getByText('Give the group a name')).toBeInTheDocument();
    expect(calls.some((c) => c.key.startsWith('PATCH'))).toBe(false);
    await userEvent.type(name, 'North ridge, upper slope');
    await userEvent.click(screen.getByRole('button', { name: 'Save name and description' }));
    expect(await screen.findByText(/Saved. The versions and their approvals are unchanged/)).toBeInTheDocument();
    expect(calls.find((c) => c.key.startsWith('PATCH'))?.body).toEqual({ name: 'North ridge, upper slope' });
  });

  it('saves a new version from the latest members with one removed and one added', async () => {
    const { calls } = answers();
    const onClose = renderModal();
    expect(screen.getByText(/A new version starts unapproved/)).toBeInTheDocument();
    const table = await screen.findByRole('table', { name: 'Samples of the dataset version' });
    expect(await within(table).findByText('N4')).toBeInTheDocument();
    expect(screen.getByText('3 samples chosen')).toBeInTheDocument();
    const checkboxOf = (id: string) => within(within(table).getByText(id).closest('tr')!).getByRole('checkbox');
    await userEvent.click(checkboxOf('N3'));
    await userEvent.click(checkboxOf('N4'));
    await userEvent.type(screen.getByRole('textbox', { name: 'What changed' }), 'N3 was a boulder; N4 added');
    await userEvent.click(screen.getByRole('button', { name: 'Save as a new version' }));
    await vi.waitFor(() => expect(onClose).toHaveBeenCalled());
    expect(calls.find((c) => c.key.startsWith('POST'))?.body).toEqual({
      datasetVersionId: REFERENCE_VERSION,
      memberIds: ['N1', 'N2', 'N4'],
      note: 'N3 was a boulder; N4 added',
    });
  });
});

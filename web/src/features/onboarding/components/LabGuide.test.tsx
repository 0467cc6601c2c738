import { screen, within } from '@testing-library/react';
import { Route, Routes, MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { render } from '../../../test-utils/render';
import { LabGuide } from './LabGuide';

const labId = '8a2b7a8e-2f7e-4d55-9a4b-1c1b4b7e6a01';
const dataset = (kind: 'reference' | 'unknowns') => ({
  id: crypto.randomUUID(),
  labId,
  name: `${kind}.csv`,
  kind,
  createdAt: '2026-01-01T00:00:00.000Z',
  versions: [],
});

function answer(lists: { datasets: unknown[]; groups: unknown[]; studies: unknown[] }) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: RequestInfo | URL) => {
      const path = new URL(String(input), 'http://localhost').pathname;
      const body =
        path === `/api/labs/${labId}/datasets`
          ? lists.datasets
          : path === `/api/labs/${labId}/groups`
            ? { groups: lists.groups }
            : { studies: lists.studies };
      return new Response(JSON.stringify(body), { headers: { 'Content-Type': 'application/json' } });
    }),
  );
}

const renderGuide = (role: 'analyst' | 'student') =>
  render(
    <MemoryRouter>
      <Routes>
        <Route path="*" element={<LabGuide labId={labId} role={role} />} />
      </Routes>
    </MemoryRouter>,
  );

describe('LabGuide', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('walks a new lab through its first steps, ticking off what exists', async () => {
    answer({ datasets: [dataset('reference')], groups: [], studies: [] });
    renderGuide('analyst');
    const list = await screen.findByRole('list', { name: 'First steps' });
    const items = within(list).getAllByRole('listitem');
    expect(items.map((item) => item.textContent?.includes('(done)'))).toEqual([true, false, false, false]);
    expect(within(items[1]).getByRole('link', { name: 'Reference groups' })).toHaveAttribute(
      'href',
      `/labs/${labId}/groups`,
    );
    expect(screen.getByText(/statistical evidence, not proof of origin/)).toBeInTheDocument();
  });

  it('tells a student who does the reference steps instead of offering them', async () => {
    answer({ datasets: [], groups: [], studies: [] });
    renderGuide('student');
    const items = within(await screen.findByRole('list', { name: 'First steps' })).getAllByRole('listitem');
    expect(within(items[0]).queryByRole('link')).toBeNull();
    expect(items[0]).toHaveTextContent('An analyst or the PI of the lab does this.');
    expect(within(items[2]).getByRole('link', { name: 'Import a file' })).toBeInTheDocument();
  });
});

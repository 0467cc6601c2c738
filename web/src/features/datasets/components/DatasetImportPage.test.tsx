import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { FileLayout, ImportPreview } from '@provenote/shared/schemas';
import { renderRoutes } from '../../../test-utils/render';
import { DatasetImportPage } from './DatasetImportPage';

const LAB = '11111111-1111-4111-8111-111111111111';
const FILE = '22222222-2222-4222-8222-222222222222';
const options = { delimiter: ',', decimalSeparator: '.', encoding: 'utf-8', unitsRow: false, sheet: null } as const;

const layout: FileLayout = {
  file: { id: FILE, filename: 'survey.csv', sizeBytes: 80, sha256: 'ab'.repeat(32), format: 'csv' },
  headers: ['Sample', 'SiO2 (wt%)', 'Zr_ppm'],
  unitsRow: null,
  fingerprint: 'f',
  sheets: [],
  mapping: {
    options,
    columns: [
      { index: 0, header: 'Sample', role: 'sample_id', element: null, unit: null, oxide: null },
      { index: 1, header: 'SiO2 (wt%)', role: 'measurement', element: 'Si', unit: 'wt% oxide', oxide: 'SiO2' },
      { index: 2, header: 'Zr_ppm', role: 'measurement', element: 'Zr', unit: 'ppm', oxide: null },
    ],
  },
  mappingSource: 'guessed',
  notes: [],
};

const preview: ImportPreview = {
  summary: { rowsRead: 2, imported: 2, flagged: 1, rejected: 0, blankRowsSkipped: 0 },
  columns: [
    { index: 1, header: 'SiO2 (wt%)', element: 'Si', unit: 'wt% oxide', oxide: 'SiO2', factorToPpm: 4674.3 },
    { index: 2, header: 'Zr_ppm', element: 'Zr', unit: 'ppm', oxide: null, factorToPpm: 1 },
  ],
  rows: [
    {
      row: 2,
      sampleId: 'Q-1',
      group: null,
      cells: [
        { ppm: 244500, original: 52.31, flag: 'measured', raw: null },
        { ppm: 0.5, original: 0.5, flag: 'below_dl', raw: '<0.5' },
      ],
      attributes: {},
    },
  ],
  problems: [
    {
      row: 2,
      column: 'Zr_ppm',
      raw: '<0.5',
      code: 'below-detection-limit',
      message: 'Below detection limit',
      action: 'flagged; the stated limit is kept as the value',
    },
  ],
  problemCount: 1,
};

describe('DatasetImportPage', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('uploads a file, shows the guessed mapping, and previews values with their flags and problems', async () => {
    const requests: { url: string; init?: RequestInit }[] = [];
    vi.stubGlobal(
      'fetch',
      vi.fn(async (url: string, init?: RequestInit) => {
        requests.push({ url, init });
        if (url === `/api/labs/${LAB}/dataset-files`) return new Response(JSON.stringify(layout), { status: 201 });
        if (url === `/api/labs/${LAB}/dataset-files/${FILE}/preview`)
          return new Response(JSON.stringify(preview), { status: 201 });
        throw new Error(`Unexpected request to ${url}`);
      }),
    );
    document.cookie = 'provenote_csrf=token-1';
    renderRoutes([{ path: '/labs/:labId/datasets/new', element: <DatasetImportPage /> }], `/labs/${LAB}/datasets/new`);
    const input = document.querySelector('input[type="file"]') as HTMLInputElement;
    await userEvent.upload(
      input,
      new File(['Sample,SiO2 (wt%),Zr_ppm\nQ-1,52.31,<0.5\n'], 'survey.csv', { type: 'text/csv' }),
    );

    expect(await screen.findByText(/mapping guessed from the headers/)).toBeInTheDocument();
    expect(screen.getByLabelText('Oxide of SiO2 (wt%) (column 2)')).toHaveValue('SiO2');
    expect(screen.getAllByLabelText('Unit of Zr_ppm (column 3)')[0]).toHaveValue('ppm');
    expect(screen.getByRole('button', { name: 'Import' })).toBeDisabled();
    expect((requests[0].init?.headers as Record<string, string>)['X-CSRF-Token']).toBe('token-1');

    await userEvent.click(screen.getByRole('button', { name: 'Preview' }));
    await waitFor(() => expect(screen.getByRole('table', { name: 'Problems' })).toBeInTheDocument());
    expect(screen.getByLabelText('Flagged')).toHaveTextContent('1');
    expect(screen.getAllByText('Below detection limit').length).toBeGreaterThan(0);
    expect(screen.getByText('flagged; the stated limit is kept as the value')).toBeInTheDocument();
    const sent = JSON.parse(String(requests[1].init?.body));
    expect(sent.mapping.columns[1]).toMatchObject({ element: 'Si', oxide: 'SiO2' });
    expect(screen.getByRole('button', { name: 'Import' })).toBeEnabled();
  });
});

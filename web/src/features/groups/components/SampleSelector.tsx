import { Group, Text } from '@mantine/core';
import { DataTable } from 'mantine-datatable';
import 'mantine-datatable/styles.css';
import { useState } from 'react';
import type { DatasetRow } from '@provenote/shared/schemas';
import { useDatasetRows } from '../api/dataset-rows';

interface Props {
  labId: string;
  datasetId: string;
  versionNumber: number;
  selected: string[];
  onChange: (sampleIds: string[]) => void;
}

/** The samples of one dataset version, page by page, with a checkbox each; the choice survives paging. */
export function SampleSelector({ labId, datasetId, versionNumber, selected, onChange }: Props) {
  const [page, setPage] = useState(1);
  const rows = useDatasetRows(labId, datasetId, versionNumber, page);
  const records = rows.data?.rows ?? [];
  const chosen = new Set(selected);
  return (
    <>
      <Group justify="space-between">
        <Text size="sm">{selected.length} samples chosen</Text>
      </Group>
      <DataTable<DatasetRow>
        aria-label="Samples of the dataset version"
        withTableBorder
        striped
        minHeight={200}
        height={360}
        idAccessor="sampleId"
        records={records}
        fetching={rows.isFetching}
        totalRecords={rows.data?.total ?? 0}
        recordsPerPage={rows.data?.pageSize ?? 100}
        page={page}
        onPageChange={setPage}
        selectedRecords={records.filter((r) => chosen.has(r.sampleId))}
        onSelectedRecordsChange={(onPage) => {
          const pageIds = new Set(records.map((r) => r.sampleId));
          const kept = selected.filter((id) => !pageIds.has(id));
          onChange([...kept, ...onPage.map((r) => r.sampleId)]);
        }}
        columns={[
          { accessor: 'sampleId', title: 'Sample' },
          { accessor: 'group', title: 'Group column', render: (r) => r.group ?? '—' },
          ...(rows.data?.columns ?? []).slice(0, 6).map((column, i) => ({
            accessor: `cell-${column.element}`,
            title: `${column.element} (ppm)`,
            textAlign: 'right' as const,
            render: (r: DatasetRow) => r.cells[i]?.ppm ?? r.cells[i]?.raw ?? '—',
          })),
        ]}
      />
    </>
  );
}

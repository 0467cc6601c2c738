import { Alert, Anchor, Button, Group, Loader, Pagination, Stack, Table, Tabs, Text, Title } from '@mantine/core';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { useDataset, useDeleteDataset, useVersionProblems, useVersionRows } from '../api/datasets';
import { DeleteDatasetButton } from './DeleteDatasetButton';
import { ProblemList } from './ProblemList';
import { RowsTable } from './RowsTable';
import { SummaryCounts } from './SummaryCounts';

/** A dataset's version history, and the rows and problems of the version chosen. */
export function DatasetPage() {
  const { labId = '', datasetId = '' } = useParams();
  const dataset = useDataset(labId, datasetId);
  const remove = useDeleteDataset(labId);
  // As the API allows: guests only read; deleting is for analysts and PIs.
  const role = useMe().data?.memberships.find((m) => m.labId === labId)?.role;
  const mayImport = role !== undefined && role !== 'guest';
  const mayDelete = role === 'pi' || role === 'analyst';
  const navigate = useNavigate();
  const [chosen, setChosen] = useState<number | null>(null);
  if (dataset.isPending) return <Loader />;
  if (dataset.error) return <Alert color="red">{errorMessage(dataset.error)}</Alert>;
  const versions = dataset.data.versions;
  const number = chosen ?? versions.at(-1)?.number ?? 1;
  const version = versions.find((v) => v.number === number);
  const base = `/api/labs/${labId}/datasets/${datasetId}/versions/${number}`;
  return (
    <Stack>
      <Group justify="space-between">
        <Title order={2}>{dataset.data.name}</Title>
        <Group>
          {mayImport && (
            <Button component={Link} variant="light" to={`/labs/${labId}/datasets/new?datasetId=${datasetId}`}>
              Import a corrected file
            </Button>
          )}
          {mayDelete && (
            <DeleteDatasetButton
              name={dataset.data.name}
              versionCount={versions.length}
              pending={remove.isPending}
              error={remove.error}
              onConfirm={() => remove.mutate({ datasetId }, { onSuccess: () => navigate(`/labs/${labId}/datasets`) })}
            />
          )}
        </Group>
      </Group>
      <Table withTableBorder aria-label="Versions">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Version</Table.Th>
            <Table.Th>File</Table.Th>
            <Table.Th>SHA-256</Table.Th>
            <Table.Th>Imported</Table.Th>
            <Table.Th>Flagged</Table.Th>
            <Table.Th>Rejected</Table.Th>
            <Table.Th>When</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {versions.map((v) => (
            <Table.Tr key={v.id} bg={v.number === number ? 'var(--mantine-color-blue-light)' : undefined}>
              <Table.Td>
                <Anchor component="button" onClick={() => setChosen(v.number)}>
                  v{v.number}
                </Anchor>
              </Table.Td>
              <Table.Td>{v.file.filename}</Table.Td>
              <Table.Td>
                <code>{v.file.sha256.slice(0, 12)}…</code>
              </Table.Td>
              <Table.Td>{v.summary.imported}</Table.Td>
              <Table.Td>{v.summary.flagged}</Table.Td>
              <Table.Td>{v.summary.rejected}</Table.Td>
              <Table.Td>{new Date(v.createdAt).toLocaleString()}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
      {version && (
        <>
          <SummaryCounts summary={version.summary} />
          <Group>
            <Anchor href={`${base}/raw`}>Original file</Anchor>
            <Anchor href={`${base}/export.csv`}>CSV as imported</Anchor>
            <Anchor href={`${base}/export.csv?values=ppm`}>CSV in ppm</Anchor>
          </Group>
          <VersionTabs labId={labId} datasetId={datasetId} number={number} />
        </>
      )}
    </Stack>
  );
}

function VersionTabs({ labId, datasetId, number }: { labId: string; datasetId: string; number: number }) {
  const [rowsPage, setRowsPage] = useState(1);
  const [problemsPage, setProblemsPage] = useState(1);
  const rows = useVersionRows(labId, datasetId, number, rowsPage);
  const problems = useVersionProblems(labId, datasetId, number, problemsPage);
  return (
    <Tabs defaultValue="rows">
      <Tabs.List>
        <Tabs.Tab value="rows">Samples</Tabs.Tab>
        <Tabs.Tab value="problems">Problems{problems.data ? ` (${problems.data.total})` : ''}</Tabs.Tab>
      </Tabs.List>
      <Tabs.Panel value="rows" pt="sm">
        {rows.data ? (
          <Stack>
            <RowsTable columns={rows.data.columns} rows={rows.data.rows} />
            <Pagination
              total={Math.ceil(rows.data.total / rows.data.pageSize)}
              value={rowsPage}
              onChange={setRowsPage}
            />
          </Stack>
        ) : (
          <Loader />
        )}
      </Tabs.Panel>
      <Tabs.Panel value="problems" pt="sm">
        {problems.data ? (
          <Stack>
            <ProblemList problems={problems.data.problems} total={problems.data.total} />
            {problems.data.total > problems.data.pageSize && (
              <Pagination
                total={Math.ceil(problems.data.total / problems.data.pageSize)}
                value={problemsPage}
                onChange={setProblemsPage}
              />
            )}
          </Stack>
        ) : (
          <Text c="dimmed">Loading…</Text>
        )}
      </Tabs.Panel>
    </Tabs>
  );
}

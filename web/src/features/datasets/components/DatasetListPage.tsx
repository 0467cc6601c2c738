import { Alert, Anchor, Badge, Button, Group, Loader, Stack, Table, Text, Title } from '@mantine/core';
import { Link, useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { useDatasets } from '../api/datasets';

export function DatasetListPage() {
  const { labId = '' } = useParams();
  const datasets = useDatasets(labId);
  const role = useMe().data?.memberships.find((m) => m.labId === labId)?.role;
  return (
    <Stack>
      <Group justify="space-between">
        <Title order={2}>Datasets</Title>
        {role && role !== 'guest' && (
          <Button component={Link} to={`/labs/${labId}/datasets/new`}>
            Import a file
          </Button>
        )}
      </Group>
      {datasets.isPending && <Loader />}
      {datasets.error && <Alert color="red">{errorMessage(datasets.error)}</Alert>}
      {datasets.data?.length === 0 && <Text c="dimmed">No datasets yet: import a lab file to start.</Text>}
      {datasets.data && datasets.data.length > 0 && (
        <Table striped withTableBorder aria-label="Datasets">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Name</Table.Th>
              <Table.Th>Kind</Table.Th>
              <Table.Th>Latest version</Table.Th>
              <Table.Th>Samples</Table.Th>
              <Table.Th>Flagged</Table.Th>
              <Table.Th>Rejected</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {datasets.data.map((dataset) => {
              const latest = dataset.versions.at(-1);
              return (
                <Table.Tr key={dataset.id}>
                  <Table.Td>
                    <Anchor component={Link} to={`/labs/${labId}/datasets/${dataset.id}`}>
                      {dataset.name}
                    </Anchor>
                  </Table.Td>
                  <Table.Td>
                    <Badge variant="light">{dataset.kind === 'reference' ? 'Reference' : 'Unknowns'}</Badge>
                  </Table.Td>
                  <Table.Td>{latest ? `v${latest.number}` : '—'}</Table.Td>
                  <Table.Td>{latest?.summary.imported ?? 0}</Table.Td>
                  <Table.Td>{latest?.summary.flagged ?? 0}</Table.Td>
                  <Table.Td>{latest?.summary.rejected ?? 0}</Table.Td>
                </Table.Tr>
              );
            })}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}

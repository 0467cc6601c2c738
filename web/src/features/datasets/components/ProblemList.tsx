import { Table, Text } from '@mantine/core';
import type { Problem } from '@provenote/shared/schemas';

/** Problems by row and column: what the file said and what the import did about it. */
export function ProblemList({ problems, total }: { problems: Problem[]; total: number }) {
  if (total === 0) return <Text c="dimmed">No problems: every cell was a plain number.</Text>;
  return (
    <>
      <Text size="sm" c="dimmed">
        {total} problem(s){total > problems.length ? `, the first ${problems.length} shown` : ''}
      </Text>
      <Table striped withTableBorder aria-label="Problems">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Row</Table.Th>
            <Table.Th>Column</Table.Th>
            <Table.Th>In the file</Table.Th>
            <Table.Th>Problem</Table.Th>
            <Table.Th>What was done</Table.Th>
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {problems.map((problem, i) => (
            <Table.Tr key={i}>
              <Table.Td>{problem.row ?? 'file'}</Table.Td>
              <Table.Td>{problem.column ?? '—'}</Table.Td>
              <Table.Td>
                <code>{problem.raw ?? ''}</code>
              </Table.Td>
              <Table.Td>{problem.message}</Table.Td>
              <Table.Td>{problem.action}</Table.Td>
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </>
  );
}

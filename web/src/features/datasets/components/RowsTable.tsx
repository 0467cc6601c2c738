import { ScrollArea, Table } from '@mantine/core';
import type { DatasetRow, StoredColumn } from '@provenote/shared/schemas';
import { CellValue } from './CellValue';

/** Imported samples: one column per element in ppm, headed by the file's own header and unit. */
export function RowsTable({ columns, rows }: { columns: StoredColumn[]; rows: DatasetRow[] }) {
  const hasGroup = rows.some((row) => row.group !== null);
  return (
    <ScrollArea>
      <Table striped withTableBorder aria-label="Imported rows">
        <Table.Thead>
          <Table.Tr>
            <Table.Th>Row</Table.Th>
            <Table.Th>Sample</Table.Th>
            {hasGroup && <Table.Th>Group</Table.Th>}
            {columns.map((column) => (
              <Table.Th key={column.index} title={`From "${column.header}" (${column.unit})`}>
                {column.element} ppm
              </Table.Th>
            ))}
          </Table.Tr>
        </Table.Thead>
        <Table.Tbody>
          {rows.map((row) => (
            <Table.Tr key={row.row}>
              <Table.Td>{row.row}</Table.Td>
              <Table.Td style={{ whiteSpace: 'nowrap' }}>{row.sampleId}</Table.Td>
              {hasGroup && <Table.Td>{row.group ?? '—'}</Table.Td>}
              {row.cells.map((cell, j) => (
                <Table.Td key={j}>
                  <CellValue cell={cell} unit={columns[j].unit} />
                </Table.Td>
              ))}
            </Table.Tr>
          ))}
        </Table.Tbody>
      </Table>
    </ScrollArea>
  );
}

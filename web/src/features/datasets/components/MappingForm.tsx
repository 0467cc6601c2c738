import { Select, Table, TextInput } from '@mantine/core';
import {
  type ColumnMapping,
  type DatasetMapping,
  columnRoleLabels,
  columnRoles,
  measurementUnits,
} from '@provenote/shared/schemas';

const roleOptions = columnRoles.map((role) => ({ value: role, label: columnRoleLabels[role] }));

interface Props {
  mapping: DatasetMapping;
  onChange: (mapping: DatasetMapping) => void;
  unitsRow: string[] | null;
}

/** One line per column of the file: its role, and for measurements the element and unit (guesses pre-filled). */
export function MappingForm({ mapping, onChange, unitsRow }: Props) {
  const update = (index: number, change: Partial<ColumnMapping>) =>
    onChange({ ...mapping, columns: mapping.columns.map((c) => (c.index === index ? { ...c, ...change } : c)) });
  return (
    <Table withTableBorder aria-label="Column mapping">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Column in the file</Table.Th>
          <Table.Th>Role</Table.Th>
          <Table.Th>Element</Table.Th>
          <Table.Th>Unit</Table.Th>
          <Table.Th>Oxide</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {mapping.columns.map((column) => {
          const measured = column.role === 'measurement';
          const label = `${column.header} (column ${column.index + 1})`;
          return (
            <Table.Tr key={column.index}>
              <Table.Td>
                {column.header}
                {unitsRow?.[column.index] ? ` [${unitsRow[column.index]}]` : ''}
              </Table.Td>
              <Table.Td>
                <Select
                  aria-label={`Role of ${label}`}
                  data={roleOptions}
                  value={column.role}
                  allowDeselect={false}
                  onChange={(role) => role && update(column.index, { role: role as ColumnMapping['role'] })}
                />
              </Table.Td>
              <Table.Td>
                {measured && (
                  <TextInput
                    aria-label={`Element of ${label}`}
                    value={column.element ?? ''}
                    error={column.element ? undefined : 'Name the element, e.g. Zr'}
                    onChange={(event) => update(column.index, { element: event.currentTarget.value || null })}
                  />
                )}
              </Table.Td>
              <Table.Td>
                {measured && (
                  <Select
                    aria-label={`Unit of ${label}`}
                    data={[...measurementUnits]}
                    value={column.unit}
                    error={column.unit ? undefined : 'Choose the unit'}
                    onChange={(unit) => update(column.index, { unit: unit as ColumnMapping['unit'] })}
                  />
                )}
              </Table.Td>
              <Table.Td>
                {measured && column.unit === 'wt% oxide' && (
                  <TextInput
                    aria-label={`Oxide of ${label}`}
                    value={column.oxide ?? ''}
                    error={column.oxide ? undefined : 'Give the formula, e.g. SiO2'}
                    onChange={(event) => update(column.index, { oxide: event.currentTarget.value || null })}
                  />
                )}
              </Table.Td>
            </Table.Tr>
          );
        })}
      </Table.Tbody>
    </Table>
  );
}

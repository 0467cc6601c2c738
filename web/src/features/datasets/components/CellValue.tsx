import { Badge, Group, Text, Tooltip } from '@mantine/core';
import { type CellFlag, cellFlagLabels } from '@provenote/shared/schemas';

const FLAG_COLOURS: Record<CellFlag, string> = {
  measured: 'gray',
  negative: 'grape',
  below_dl: 'blue',
  below_dl_unstated: 'indigo',
  not_determined: 'orange',
  empty: 'gray',
  unreadable: 'red',
};

interface Props {
  cell: { ppm: number | null; original: number | null; flag: CellFlag; raw: string | null };
  unit: string;
}

/** A stored value in ppm, with its flag and, on hover, what the file said in its own unit. */
export function CellValue({ cell, unit }: Props) {
  const shown = cell.ppm === null ? '—' : `${cell.flag === 'below_dl' ? '<' : ''}${Number(cell.ppm.toPrecision(6))}`;
  const original = cell.raw ?? (cell.original === null ? '' : String(cell.original));
  return (
    <Tooltip label={`In the file: ${original || '(empty)'} ${original ? unit : ''}`}>
      <Group gap={4} wrap="nowrap">
        <Text size="sm">{shown}</Text>
        {cell.flag !== 'measured' && (
          <Badge size="xs" variant="light" color={FLAG_COLOURS[cell.flag]}>
            {cellFlagLabels[cell.flag]}
          </Badge>
        )}
      </Group>
    </Tooltip>
  );
}

import { Group, Paper, Text } from '@mantine/core';
import type { ImportSummary } from '@provenote/shared/schemas';

const LABELS: [keyof ImportSummary, string][] = [
  ['rowsRead', 'Rows read'],
  ['imported', 'Imported'],
  ['flagged', 'Flagged'],
  ['rejected', 'Rejected'],
  ['blankRowsSkipped', 'Blank rows skipped'],
];

export function SummaryCounts({ summary }: { summary: ImportSummary }) {
  return (
    <Group>
      {LABELS.map(([key, label]) => (
        <Paper key={key} withBorder p="xs" aria-label={label}>
          <Text size="xs" c="dimmed">
            {label}
          </Text>
          <Text fw={700}>{summary[key]}</Text>
        </Paper>
      ))}
    </Group>
  );
}

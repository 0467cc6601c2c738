import { SegmentedControl, Stack, Text } from '@mantine/core';
import { useState } from 'react';
import type { AssignmentRow, AssignmentsPage } from '@provenote/shared/schemas';
import { heatmapTrace, type ProbabilityBasis } from '../model/heatmap';
import { Chart } from './Chart';

interface Props {
  page: AssignmentsPage;
  initialBasis: ProbabilityBasis;
  onOpen: (row: AssignmentRow) => void;
}

/** Probabilities of the unknowns on the current results page for every group; a click opens the sample. */
export function ProbabilityHeatmap({ page, initialBasis, onOpen }: Props) {
  const [basis, setBasis] = useState<ProbabilityBasis>(initialBasis);
  if (page.rows.length === 0) return <Text size="sm">No unknowns on this page to draw.</Text>;
  return (
    <Stack gap="xs">
      <SegmentedControl
        aria-label="Probability shown"
        w="fit-content"
        data={[
          { value: 'hotelling', label: 'Hotelling' },
          { value: 'chi2', label: 'χ²' },
        ]}
        value={basis}
        onChange={(b) => setBasis(b as ProbabilityBasis)}
      />
      <Chart
        label="Membership probability of each unknown for each group"
        filename="membership-probabilities"
        data={[heatmapTrace(page, basis)]}
        layout={{ yaxis: { autorange: 'reversed', title: { text: 'Unknown' } }, xaxis: { title: { text: 'Group' } } }}
        height={Math.max(320, 18 * page.rows.length + 120)}
        onPointClick={(point) => {
          const row = page.rows.find((r) => r.sampleId === point.y);
          if (row) onOpen(row);
        }}
      />
      <Text size="xs" c="dimmed">
        The rows are the unknowns on the results page shown in the table (its filters and sorting apply).
      </Text>
    </Stack>
  );
}

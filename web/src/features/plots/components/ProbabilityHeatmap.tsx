import { Alert, Loader, SegmentedControl, Stack, Text } from '@mantine/core';
import { useState } from 'react';
import { errorMessage } from '../../../app/api-client';
import { useProbabilityMap } from '../api/probability-map';
import { heatmapHeight, heatmapLayout, heatmapTrace, type ProbabilityBasis } from '../model/heatmap';
import { Chart } from './Chart';

interface Props {
  labId: string;
  runId: string;
  initialBasis: ProbabilityBasis;
  /** Called with the sample id of a clicked row. */
  onOpenUnknown: (sampleId: string) => void;
}

const count = new Intl.NumberFormat();

/** Probabilities of every unknown of the run for every group; a click opens the sample. */
export function ProbabilityHeatmap({ labId, runId, initialBasis, onOpenUnknown }: Props) {
  const [basis, setBasis] = useState<ProbabilityBasis>(initialBasis);
  const map = useProbabilityMap(labId, runId);
  if (map.isPending) return <Loader size="sm" aria-label="Loading the heat map" />;
  if (map.isError) return <Alert color="red">Could not load the heat map: {errorMessage(map.error)}</Alert>;
  if (map.data.rows.length === 0) return <Text size="sm">This run has no unknowns to draw.</Text>;
  const { total, stride, rows } = map.data;
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
        data={[heatmapTrace(map.data, basis)]}
        layout={heatmapLayout(map.data)}
        height={heatmapHeight(map.data)}
        onPointClick={(point) => {
          if (typeof point.y === 'string') onOpenUnknown(point.y);
        }}
      />
      <Text size="xs" c="dimmed">
        {stride === 1
          ? `All ${count.format(total)} unknowns of the run, grouped by their best group and sorted by probability within it.`
          : `${count.format(rows.length)} of the run's ${count.format(total)} unknowns: grouped by best group and sorted by probability, then every ${stride}th drawn, so each group keeps its share. Search the table for any other sample.`}{' '}
        A probability is statistical evidence of membership, not proof of origin.
      </Text>
    </Stack>
  );
}

import { Alert, Group, Select, Stack, Switch, Text } from '@mantine/core';
import { useState } from 'react';
import { errorMessage } from '../../../app/api-client';
import { useScatter } from '../api/scatter';
import { scatterTraces } from '../model/scatter';
import { Chart } from './Chart';

interface Props {
  labId: string;
  studyId: string;
  elements: string[];
  groupOrder: string[];
  /** Called with the sample id of a clicked unknown. */
  onOpenUnknown: (sampleId: string) => void;
}

/** Any two measured elements: reference members by group, unknowns overlaid by verdict. */
export function BivariatePlot({ labId, studyId, elements, groupOrder, onOpenUnknown }: Props) {
  const [x, setX] = useState<string | null>(elements[0] ?? null);
  const [y, setY] = useState<string | null>(elements[1] ?? null);
  const [log, setLog] = useState(true);
  const scatter = useScatter(labId, studyId, x, y);
  return (
    <Stack gap="xs">
      <Group align="flex-end">
        <Select label="Horizontal" data={elements} value={x} onChange={setX} allowDeselect={false} w={140} />
        <Select label="Vertical" data={elements} value={y} onChange={setY} allowDeselect={false} w={140} />
        <Switch label="Logarithmic axes" checked={log} onChange={(e) => setLog(e.currentTarget.checked)} />
      </Group>
      {x === y && <Text size="sm">Choose two different elements.</Text>}
      {scatter.isError && <Alert color="red">Could not load the values: {errorMessage(scatter.error)}</Alert>}
      {scatter.data && (
        <>
          <Chart
            label={`${scatter.data.y} against ${scatter.data.x}`}
            filename={`${scatter.data.x}-${scatter.data.y}`}
            data={scatterTraces(scatter.data, groupOrder)}
            layout={{
              xaxis: { title: { text: `${scatter.data.x} (ppm)` }, type: log ? 'log' : 'linear' },
              yaxis: { title: { text: `${scatter.data.y} (ppm)` }, type: log ? 'log' : 'linear' },
              legend: { orientation: 'h', y: -0.2 },
            }}
            onPointClick={(point) => {
              const id = typeof point.customdata === 'string' ? point.customdata : null;
              if (id && scatter.data.unknowns.some((u) => u.sampleId === id)) onOpenUnknown(id);
            }}
          />
          <Text size="xs" c="dimmed">
            Values as measured (ppm), not transformed; the assignment used the Prepare card's transform.
            {scatter.data.truncated && ' Only the first unknowns in file order are drawn.'}
          </Text>
        </>
      )}
    </Stack>
  );
}

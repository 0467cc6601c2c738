import { Alert, Group, SegmentedControl, Select, Stack, Switch, Text } from '@mantine/core';
import { useState } from 'react';
import type { ScatterQuery } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useScatter } from '../api/scatter';
import { scatterTraces } from '../model/scatter';
import { Chart } from './Chart';

type Space = ScatterQuery['space'];

interface Props {
  labId: string;
  studyId: string;
  /** The Prepare card's elements, in its order. */
  elements: string[];
  groupOrder: string[];
  /** Called with the sample id of a clicked unknown. */
  onOpenUnknown: (sampleId: string) => void;
}

/**
 * Any two coordinates the assignment computed in (after the Prepare card's transform), or two measured
 * elements in ppm: reference members by group, unknowns overlaid by verdict.
 */
export function BivariatePlot({ labId, studyId, elements, groupOrder, onOpenUnknown }: Props) {
  const [space, setSpace] = useState<Space>('prepared');
  // Until chosen, the API draws the first two coordinates of the space and names them all.
  const [x, setX] = useState<string | null>(null);
  const [y, setY] = useState<string | null>(null);
  const [log, setLog] = useState(true);
  const scatter = useScatter(labId, studyId, space, x, y);
  const shown = scatter.data;
  // The transform "none" keeps the element names as they are; every other transform renames them.
  const inPpm =
    shown !== undefined && (shown.space === 'measured' || shown.variables.every((name, i) => name === elements[i]));
  const chooseSpace = (next: string) => {
    setSpace(next as Space);
    setX(null);
    setY(null);
  };
  // Both axes are pinned once either is chosen, so the API's default for the other cannot collide with it.
  const choose = (axis: 'x' | 'y') => (value: string | null) => {
    setX(axis === 'x' ? value : (x ?? shown?.x ?? null));
    setY(axis === 'y' ? value : (y ?? shown?.y ?? null));
  };
  const title = (name: string) => (inPpm ? `${name} (ppm)` : name);
  return (
    <Stack gap="xs">
      <Group align="flex-end">
        <SegmentedControl
          aria-label="Values to plot"
          value={space}
          onChange={chooseSpace}
          data={[
            { value: 'prepared', label: 'As prepared for the assignment' },
            { value: 'measured', label: 'As measured (ppm)' },
          ]}
        />
        <Select
          label="Horizontal"
          data={shown?.variables ?? []}
          value={shown?.x ?? null}
          onChange={choose('x')}
          allowDeselect={false}
          w={160}
        />
        <Select
          label="Vertical"
          data={shown?.variables ?? []}
          value={shown?.y ?? null}
          onChange={choose('y')}
          allowDeselect={false}
          w={160}
        />
        {inPpm && <Switch label="Logarithmic axes" checked={log} onChange={(e) => setLog(e.currentTarget.checked)} />}
      </Group>
      {x !== null && x === y && <Text size="sm">Choose two different coordinates.</Text>}
      {scatter.isError && <Alert color="red">Could not load the values: {errorMessage(scatter.error)}</Alert>}
      {shown && (
        <>
          <Chart
            label={`${shown.y} against ${shown.x}`}
            filename={`${shown.x}-${shown.y}`}
            data={scatterTraces(shown, groupOrder, inPpm)}
            layout={{
              xaxis: { title: { text: title(shown.x) }, type: inPpm && log ? 'log' : 'linear' },
              yaxis: { title: { text: title(shown.y) }, type: inPpm && log ? 'log' : 'linear' },
              legend: { orientation: 'h', y: -0.2 },
            }}
            onPointClick={(point) => {
              const id = typeof point.customdata === 'string' ? point.customdata : null;
              if (id && shown.unknowns.some((u) => u.sampleId === id)) onOpenUnknown(id);
            }}
          />
          <Text size="xs" c="dimmed">
            {shown.space === 'prepared'
              ? 'The coordinates the assignment computed in: values below the detection limit replaced and transformed as the Prepare card says.'
              : 'Values as measured (ppm), not transformed; the assignment used the Prepare card’s transform.'}
            {shown.truncated && ' Only the first unknowns in file order are drawn.'}
          </Text>
        </>
      )}
    </Stack>
  );
}

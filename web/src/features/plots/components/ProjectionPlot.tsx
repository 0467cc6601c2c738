import { Alert, Group, SegmentedControl, Stack, Text } from '@mantine/core';
import { useState } from 'react';
import { PROJECTION_LEVELS, type ProjectionLevel, type ProjectionMethod } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useProjection } from '../api/projection';
import { axisTitle, projectionTraces } from '../model/projection';
import { Chart } from './Chart';

interface Props {
  labId: string;
  runId: string;
  groupOrder: string[];
  /** Called with the sample id of a clicked unknown. */
  onOpenUnknown: (sampleId: string) => void;
}

const methodLabels: Record<ProjectionMethod, string> = {
  pca: 'Principal components',
  cv: 'Canonical variates',
};

/** The reference samples and unknowns of an assign run on two projected axes, with each group's ellipse. */
export function ProjectionPlot({ labId, runId, groupOrder, onOpenUnknown }: Props) {
  const [method, setMethod] = useState<ProjectionMethod>('pca');
  const [level, setLevel] = useState<ProjectionLevel>(0.95);
  const projection = useProjection(labId, runId, method, level);
  const data = projection.data;
  const noEllipse = data?.groups.filter((g) => g.ellipseNote) ?? [];
  return (
    <Stack gap="xs">
      <Group align="flex-end">
        <Stack gap={4}>
          <Text size="sm" fw={500} id="projection-method-label">
            Axes
          </Text>
          <SegmentedControl
            aria-labelledby="projection-method-label"
            data={(['pca', 'cv'] as const).map((value) => ({ value, label: methodLabels[value] }))}
            value={method}
            onChange={(value) => setMethod(value as ProjectionMethod)}
          />
        </Stack>
        <Stack gap={4}>
          <Text size="sm" fw={500} id="projection-level-label">
            Ellipse level
          </Text>
          <SegmentedControl
            aria-labelledby="projection-level-label"
            data={PROJECTION_LEVELS.map((value) => ({ value: String(value), label: `${Math.round(value * 100)} %` }))}
            value={String(level)}
            onChange={(value) => setLevel(Number(value) as ProjectionLevel)}
          />
        </Stack>
      </Group>
      {projection.isError && <Alert color="red">Could not load the projection: {errorMessage(projection.error)}</Alert>}
      {data?.unavailable && (
        <Alert color="gray" title={`No ${methodLabels[data.method].toLowerCase()} plot for this run`}>
          {data.unavailable}.
        </Alert>
      )}
      {data && !data.unavailable && (
        <>
          <Chart
            label={`${methodLabels[data.method]} of the reference groups and the unknowns`}
            filename={`${data.method === 'pca' ? 'principal-components' : 'canonical-variates'}-${Math.round(data.level * 100)}`}
            data={projectionTraces(data, groupOrder)}
            layout={{
              xaxis: { title: { text: axisTitle(data.axes[0]) }, zeroline: false },
              yaxis: { title: { text: axisTitle(data.axes[1]) }, zeroline: false },
              legend: { orientation: 'h', y: -0.2 },
            }}
            onPointClick={(point) => {
              const id = typeof point.customdata === 'string' ? point.customdata : null;
              if (id && data.unknowns.some((u) => u.sampleId === id)) onOpenUnknown(id);
            }}
          />
          <Text size="xs" c="dimmed">
            {data.method === 'pca'
              ? `Principal components of the ${data.basis} matrix of the reference samples' transformed values.`
              : 'Canonical variates: the directions that best separate the reference groups (W⁻¹B).'}{' '}
            Each ellipse is drawn from its group's fitted mean and covariance,{' '}
            {data.ellipseBasis === 'f' ? 'F based (wider for small groups)' : 'χ² based'}. A point inside an ellipse on
            two axes may still lie far from the group on the others: the verdict uses every axis.
            {data.unknownTotal > data.unknowns.length &&
              ` Only the first ${data.unknowns.length.toLocaleString()} of ${data.unknownTotal.toLocaleString()} unknowns in file order are drawn.`}
          </Text>
          {noEllipse.length > 0 && (
            <Text size="xs" c="orange.8">
              No ellipse for {noEllipse.map((g) => `${g.name} (${g.ellipseNote})`).join('; ')}.
            </Text>
          )}
        </>
      )}
    </Stack>
  );
}

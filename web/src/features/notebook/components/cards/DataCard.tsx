import { Button, Group, Select, Stack, Text } from '@mantine/core';
import { useState } from 'react';
import type { Dataset, DatasetKind, StepParameters } from '@provenote/shared/schemas';
import { useDatasetList } from '../../api/datasets';
import type { CardProps } from './card-props';

const versionOptions = (datasets: Dataset[], kind: DatasetKind) =>
  datasets
    .filter((d) => d.kind === kind)
    .map((d) => ({
      group: d.name,
      items: d.versions.map((v) => ({
        value: v.id,
        label: `${d.name} — version ${v.number} (${v.summary.imported} samples)`,
      })),
    }));

export function DataCard({ labId, step, readOnly, onSave, saving, errors }: CardProps) {
  const saved = step.parameters as StepParameters['data'] | null;
  const [reference, setReference] = useState<string | null>(saved?.referenceVersionId ?? null);
  const [unknowns, setUnknowns] = useState<string | null>(saved?.unknownsVersionId ?? null);
  const datasets = useDatasetList(labId);
  const list = datasets.data ?? [];
  if (datasets.isSuccess && list.length === 0) {
    return (
      <Text size="sm">
        No datasets in this lab yet. Import the reference data (and the unknowns) under Datasets first.
      </Text>
    );
  }
  return (
    <Stack gap="sm">
      <Select
        label="Reference data"
        description="The samples of known source; a version is pinned, so later corrections do not change this study."
        placeholder={datasets.isPending ? 'Loading datasets…' : 'Choose a dataset version'}
        data={versionOptions(list, 'reference')}
        value={reference}
        onChange={setReference}
        disabled={readOnly}
        error={errors.referenceVersionId}
        searchable
      />
      <Select
        label="Unknowns"
        description="The samples to assign; may be chosen later, before the Assign card."
        placeholder="Choose a dataset version"
        data={versionOptions(list, 'unknowns')}
        value={unknowns}
        onChange={setUnknowns}
        disabled={readOnly}
        error={errors.unknownsVersionId}
        clearable
        searchable
      />
      {!readOnly && (
        <Group>
          <Button
            onClick={() => onSave({ referenceVersionId: reference, unknownsVersionId: unknowns })}
            loading={saving}
            disabled={!reference}
          >
            Save data
          </Button>
        </Group>
      )}
    </Stack>
  );
}

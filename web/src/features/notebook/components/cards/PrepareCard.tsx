import {
  Button,
  Group,
  MultiSelect,
  NumberInput,
  SegmentedControl,
  Select,
  SimpleGrid,
  Stack,
  Text,
} from '@mantine/core';
import { useState } from 'react';
import type { StepParameters } from '@provenote/shared/schemas';
import { useDatasetList } from '../../api/datasets';
import { useElementSummary } from '../../api/element-summary';
import { ElementSummaryTable } from '../ElementSummaryTable';
import { stepParameters, type CardProps } from './card-props';

type Prepare = StepParameters['prepare'];

const transforms: { value: Prepare['transform']; label: string }[] = [
  { value: 'none', label: 'None (ppm as measured)' },
  { value: 'log10', label: 'log10' },
  { value: 'ln', label: 'Natural log' },
  { value: 'alr', label: 'Additive log-ratio (alr)' },
  { value: 'clr', label: 'Centred log-ratio (clr)' },
  { value: 'ilr', label: 'Isometric log-ratio (ilr)' },
];

const belowDetection: { value: Prepare['belowDetection']; label: string }[] = [
  { value: 'dl-half', label: 'Half the detection limit' },
  { value: 'dl-sqrt2', label: 'Detection limit ÷ √2' },
  { value: 'multiplicative', label: 'Multiplicative replacement' },
];

const defaults: Prepare = {
  elements: [],
  transform: 'clr',
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 1,
};

export function PrepareCard({ labId, study, step, readOnly, onSave, saving, errors }: CardProps) {
  const [values, setValues] = useState<Prepare>((step.parameters as Prepare | null) ?? defaults);
  const set = <K extends keyof Prepare>(key: K, value: Prepare[K]) => setValues((v) => ({ ...v, [key]: value }));
  const referenceId = stepParameters<StepParameters['data']>(study, 'data')?.referenceVersionId;
  const datasets = useDatasetList(labId);
  const version = datasets.data?.flatMap((d) => d.versions).find((v) => v.id === referenceId);
  const elements = [...new Set(version?.columns.map((c) => c.element) ?? values.elements)];
  const summary = useElementSummary(labId, study.id, referenceId);

  return (
    <Stack gap="sm">
      <MultiSelect
        label="Elements"
        description="The measurements distances are computed from; choose fewer than the smallest group has members."
        data={elements}
        value={values.elements}
        onChange={(chosen) => set('elements', chosen)}
        disabled={readOnly}
        error={errors.elements}
        searchable
      />
      <SimpleGrid cols={{ base: 1, md: 2 }}>
        <Select
          label="Transform"
          description="Log-ratio transforms treat the values as parts of a whole (compositional data)."
          data={transforms}
          value={values.transform}
          onChange={(t) => t && set('transform', t as Prepare['transform'])}
          disabled={readOnly}
          allowDeselect={false}
        />
        {values.transform === 'alr' && (
          <Select
            label="alr denominator"
            description="Every other element is divided by this one."
            data={values.elements}
            value={values.alrDenominator}
            onChange={(d) => set('alrDenominator', d)}
            disabled={readOnly}
            error={errors.alrDenominator}
          />
        )}
        <Select
          label="Values below the detection limit"
          data={belowDetection}
          value={values.belowDetection}
          onChange={(b) => b && set('belowDetection', b as Prepare['belowDetection'])}
          disabled={readOnly}
          allowDeselect={false}
        />
        <Stack gap={4}>
          <Text size="sm" fw={500} id="covariance-label">
            Covariance
          </Text>
          <SegmentedControl
            aria-labelledby="covariance-label"
            data={[
              { value: 'classic', label: 'Classic' },
              { value: 'mcd', label: 'Robust (MCD)' },
            ]}
            value={values.covariance}
            onChange={(c) => set('covariance', c as Prepare['covariance'])}
            disabled={readOnly}
          />
        </Stack>
        {values.covariance === 'mcd' && (
          <NumberInput
            label="Random seed"
            description="The robust fit draws random subsets; the seed makes the run repeatable."
            value={values.seed}
            onChange={(s) => set('seed', typeof s === 'number' ? s : 0)}
            min={0}
            allowDecimal={false}
            disabled={readOnly}
            error={errors.seed}
          />
        )}
      </SimpleGrid>
      {summary.data && <ElementSummaryTable summary={summary.data} chosen={values.elements} />}
      {!readOnly && (
        <Group>
          <Button onClick={() => onSave(values)} loading={saving}>
            Save preparation
          </Button>
        </Group>
      )}
    </Stack>
  );
}

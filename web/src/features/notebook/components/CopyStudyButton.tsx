import { Button, Group, Modal, Select, Stack, Text, TextInput } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { StepParameters, Study } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useCopyStudy } from '../../studies/api/studies';
import { useDatasetList } from '../api/datasets';
import { stepParameters } from './cards/card-props';

/** "Copy with new data": the same settings on other unknowns (or other reference data). */
export function CopyStudyButton({ labId, study }: { labId: string; study: Study }) {
  const [opened, { open, close }] = useDisclosure(false);
  const data = stepParameters<StepParameters['data']>(study, 'data');
  const [name, setName] = useState(`${study.name} (copy)`);
  const [reference, setReference] = useState<string | null>(data?.referenceVersionId ?? null);
  const [unknowns, setUnknowns] = useState<string | null>(null);
  const datasets = useDatasetList(labId);
  const copy = useCopyStudy(labId, study.id);
  const navigate = useNavigate();
  const options = (kind: 'reference' | 'unknowns') =>
    (datasets.data ?? [])
      .filter((d) => d.kind === kind)
      .flatMap((d) => d.versions.map((v) => ({ value: v.id, label: `${d.name} — version ${v.number}` })));
  return (
    <>
      <Button variant="default" onClick={open}>
        Copy with new data
      </Button>
      <Modal opened={opened} onClose={close} title="Copy with new data">
        <Stack>
          <TextInput label="Name of the copy" value={name} onChange={(e) => setName(e.currentTarget.value)} />
          <Select
            label="Reference data"
            description="Keeping the same reference data keeps the groups and exclusions."
            data={options('reference')}
            value={reference}
            onChange={setReference}
          />
          <Select label="Unknowns" data={options('unknowns')} value={unknowns} onChange={setUnknowns} clearable />
          {copy.isError && (
            <Text c="red" size="sm">
              {errorMessage(copy.error)}
            </Text>
          )}
          <Group justify="flex-end">
            <Button variant="default" onClick={close}>
              Cancel
            </Button>
            <Button
              disabled={!reference || name.trim() === ''}
              loading={copy.isPending}
              onClick={() =>
                reference &&
                copy.mutate(
                  { name, data: { referenceVersionId: reference, unknownsVersionId: unknowns } },
                  {
                    onSuccess: (created) => {
                      close();
                      navigate(`/labs/${labId}/studies/${created.id}`);
                    },
                  },
                )
              }
            >
              Copy
            </Button>
          </Group>
        </Stack>
      </Modal>
    </>
  );
}

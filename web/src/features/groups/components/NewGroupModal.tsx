import { Button, Group, Modal, Select, Stack, Text, Textarea, TextInput } from '@mantine/core';
import { useState } from 'react';
import { createGroupSchema, type Dataset } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useCreateGroup } from '../api/groups';
import { SampleSelector } from './SampleSelector';

interface Props {
  labId: string;
  datasets: Dataset[];
  opened: boolean;
  onClose: () => void;
}

/** A group built by hand: a name, and samples chosen from one reference dataset version. */
export function NewGroupModal({ labId, datasets, opened, onClose }: Props) {
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const [versionId, setVersionId] = useState<string | null>(null);
  const [memberIds, setMemberIds] = useState<string[]>([]);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const create = useCreateGroup(labId);
  const versions = datasets.flatMap((d) => d.versions.map((v) => ({ dataset: d, version: v })));
  const chosen = versions.find((v) => v.version.id === versionId);

  const submit = () => {
    const parsed = createGroupSchema.safeParse({ name, description, datasetVersionId: versionId ?? '', memberIds });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: () => {
        setName('');
        setMemberIds([]);
        onClose();
      },
    });
  };

  return (
    <Modal opened={opened} onClose={onClose} title="New reference group" size="xl">
      <Stack>
        <TextInput label="Name" value={name} onChange={(e) => setName(e.currentTarget.value)} error={errors.name} />
        <Textarea
          label="Description"
          description="Where the source is and how its samples were taken."
          value={description}
          onChange={(e) => setDescription(e.currentTarget.value)}
          rows={2}
        />
        <Select
          label="Reference data"
          data={versions.map(({ dataset, version }) => ({
            value: version.id,
            label: `${dataset.name} — version ${version.number}`,
          }))}
          value={versionId}
          onChange={(v) => {
            setVersionId(v);
            setMemberIds([]);
          }}
          error={errors.datasetVersionId}
        />
        {chosen && (
          <SampleSelector
            labId={labId}
            datasetId={chosen.dataset.id}
            versionNumber={chosen.version.number}
            selected={memberIds}
            onChange={setMemberIds}
          />
        )}
        {errors.memberIds && (
          <Text c="red" size="sm">
            {errors.memberIds}
          </Text>
        )}
        {create.isError && (
          <Text c="red" size="sm">
            {errorMessage(create.error)}
          </Text>
        )}
        <Group justify="flex-end">
          <Button variant="default" onClick={onClose}>
            Cancel
          </Button>
          <Button onClick={submit} loading={create.isPending}>
            Create group
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}

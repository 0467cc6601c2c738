import { Button, Group, Modal, Stack, Text, Textarea, TextInput } from '@mantine/core';
import { useState } from 'react';
import { createGroupSchema, type Dataset } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useCreateGroup } from '../api/groups';
import { MemberPicker } from './MemberPicker';

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
        <MemberPicker
          labId={labId}
          datasets={datasets}
          versionId={versionId}
          memberIds={memberIds}
          membersFor={() => []}
          onChange={(version, members) => {
            setVersionId(version);
            setMemberIds(members);
          }}
          versionError={errors.datasetVersionId}
          membersError={errors.memberIds}
        />
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

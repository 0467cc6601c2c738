import { Alert, Button, Divider, Group, Modal, Stack, Text, Textarea, TextInput, Title } from '@mantine/core';
import { useState } from 'react';
import {
  createGroupVersionSchema,
  updateGroupSchema,
  type Dataset,
  type ReferenceGroup,
} from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useAddGroupVersion, useUpdateGroup } from '../api/groups';
import { MemberPicker } from './MemberPicker';

interface Props {
  labId: string;
  group: ReferenceGroup;
  datasets: Dataset[];
  onClose: () => void;
}

type Issues = { issues: { path: PropertyKey[]; message: string }[] };
const fieldErrors = ({ issues }: Issues) =>
  Object.fromEntries(issues.map((i) => [String(i.path[0] ?? 'form'), i.message]));

/**
 * Rename a group or edit its description (no new version: the members stay), or save a new hand-made
 * version of its members. Earlier versions never change, so a study that used one keeps its record.
 */
export function EditGroupModal({ labId, group, datasets, onClose }: Props) {
  const latest = group.versions[0];
  const [name, setName] = useState(group.name);
  const [description, setDescription] = useState(group.description);
  const [detailErrors, setDetailErrors] = useState<Record<string, string>>({});
  const [versionId, setVersionId] = useState<string | null>(latest?.datasetVersionId ?? null);
  const [memberIds, setMemberIds] = useState<string[]>(latest?.memberIds ?? []);
  const [note, setNote] = useState('');
  const [versionErrors, setVersionErrors] = useState<Record<string, string>>({});
  const update = useUpdateGroup(labId, group.id);
  const addVersion = useAddGroupVersion(labId, group.id);

  const saveDetails = () => {
    const changes = {
      ...(name !== group.name && { name }),
      ...(description !== group.description && { description }),
    };
    const parsed = updateGroupSchema.safeParse(changes);
    if (!parsed.success) return setDetailErrors(fieldErrors(parsed.error));
    setDetailErrors({});
    update.mutate(parsed.data);
  };

  const saveVersion = () => {
    const parsed = createGroupVersionSchema.safeParse({ datasetVersionId: versionId ?? '', memberIds, note });
    if (!parsed.success) return setVersionErrors(fieldErrors(parsed.error));
    setVersionErrors({});
    addVersion.mutate(parsed.data, { onSuccess: onClose });
  };

  return (
    <Modal opened onClose={onClose} title={`Edit ${group.name}`} size="xl">
      <Stack>
        <Title order={4}>Name and description</Title>
        <TextInput
          label="Name"
          value={name}
          onChange={(e) => setName(e.currentTarget.value)}
          error={detailErrors.name}
        />
        <Textarea
          label="Description"
          description="Where the source is and how its samples were taken."
          value={description}
          onChange={(e) => setDescription(e.currentTarget.value)}
          error={detailErrors.description}
          rows={2}
        />
        {detailErrors.form && (
          <Text c="red" size="sm">
            {detailErrors.form}
          </Text>
        )}
        {update.isError && (
          <Text c="red" size="sm">
            {errorMessage(update.error)}
          </Text>
        )}
        {update.isSuccess && !update.isPending && (
          <Text c="teal" size="sm">
            Saved. The versions and their approvals are unchanged.
          </Text>
        )}
        <Group justify="flex-end">
          <Button variant="light" onClick={saveDetails} loading={update.isPending}>
            Save name and description
          </Button>
        </Group>
        <Divider />
        <Title order={4}>New version of the members</Title>
        <Alert color="yellow" variant="light">
          A new version starts unapproved: students can assign against it once an analyst or PI approves it. Version{' '}
          {latest ? `v${latest.number}` : ''} stays as it is.
        </Alert>
        <MemberPicker
          labId={labId}
          datasets={datasets}
          versionId={versionId}
          memberIds={memberIds}
          // Members are sample ids of one dataset version: another version starts from an empty choice.
          membersFor={(version) => (version === latest?.datasetVersionId ? latest.memberIds : [])}
          onChange={(version, members) => {
            setVersionId(version);
            setMemberIds(members);
          }}
          versionError={versionErrors.datasetVersionId}
          membersError={versionErrors.memberIds}
        />
        <Textarea
          label="What changed"
          description="Kept with the version, e.g. which samples were added or removed and why."
          value={note}
          onChange={(e) => setNote(e.currentTarget.value)}
          error={versionErrors.note}
          rows={2}
        />
        {addVersion.isError && (
          <Text c="red" size="sm">
            {errorMessage(addVersion.error)}
          </Text>
        )}
        <Group justify="flex-end">
          <Button variant="default" onClick={onClose}>
            Close
          </Button>
          <Button onClick={saveVersion} loading={addVersion.isPending}>
            Save as a new version
          </Button>
        </Group>
      </Stack>
    </Modal>
  );
}

import { Alert, Badge, Button, Card, Group, Loader, Select, Stack, Table, Text, Title } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { useState } from 'react';
import { useParams } from 'react-router-dom';
import type { Dataset, ReferenceGroup } from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { useDatasetList } from '../../notebook/api/datasets';
import { useApproveGroupVersion, useGroupList, useGroupsFromColumn } from '../api/groups';
import { EditGroupModal } from './EditGroupModal';
import { NewGroupModal } from './NewGroupModal';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** The lab's reference groups: built from a group column or by hand, versioned, approved for students. */
export function GroupsPage() {
  const { labId = '' } = useParams();
  const me = useMe();
  const role = me.data?.memberships.find((m) => m.labId === labId)?.role;
  const mayEdit = role === 'pi' || role === 'analyst';
  const groups = useGroupList(labId);
  const datasets = useDatasetList(labId);
  const references = (datasets.data ?? []).filter((d) => d.kind === 'reference');
  const [versionId, setVersionId] = useState<string | null>(null);
  const fromColumn = useGroupsFromColumn(labId);
  const [opened, { open, close }] = useDisclosure(false);

  return (
    <Stack maw={1100}>
      <Title order={2}>Reference groups</Title>
      <Text c="dimmed">
        A reference group is a set of samples of known source. Each change of membership is a new version; an analyst or
        PI approves a version before students can assign against it.
      </Text>
      {mayEdit && (
        <Card withBorder>
          <Group align="flex-end">
            <Select
              label="Build groups from a group column"
              description="One group per value of the reference data's group column."
              placeholder="Choose a reference dataset version"
              data={references.flatMap((d) =>
                d.versions.map((v) => ({ value: v.id, label: `${d.name} — version ${v.number}` })),
              )}
              value={versionId}
              onChange={setVersionId}
              w={420}
            />
            <Button
              disabled={!versionId}
              loading={fromColumn.isPending}
              onClick={() => versionId && fromColumn.mutate(versionId)}
            >
              Build groups
            </Button>
            <Button variant="default" onClick={open}>
              New group by hand
            </Button>
          </Group>
          {fromColumn.isError && (
            <Text c="red" size="sm" mt="xs">
              {errorMessage(fromColumn.error)}
            </Text>
          )}
        </Card>
      )}
      <NewGroupModal labId={labId} datasets={references} opened={opened} onClose={close} />
      {groups.isPending && <Loader size="sm" aria-label="Loading groups" />}
      {groups.isError && <Alert color="red">Could not load the groups: {errorMessage(groups.error)}</Alert>}
      {groups.isSuccess && groups.data.groups.length === 0 && (
        <Alert color="blue" title="No reference groups yet">
          {mayEdit
            ? 'Import reference data under Datasets, then build the groups from its group column or choose samples by hand.'
            : 'An analyst or PI builds the reference groups; they appear here once built.'}
        </Alert>
      )}
      {groups.data?.groups.map((group) => (
        <GroupCard key={group.id} labId={labId} group={group} mayEdit={mayEdit} datasets={references} />
      ))}
    </Stack>
  );
}

interface GroupCardProps {
  labId: string;
  group: ReferenceGroup;
  mayEdit: boolean;
  datasets: Dataset[];
}

function GroupCard({ labId, group, mayEdit, datasets }: GroupCardProps) {
  const approve = useApproveGroupVersion(labId);
  const [editing, { open, close }] = useDisclosure(false);
  return (
    <Card withBorder component="section" aria-label={`Group ${group.name}`}>
      <Stack gap="xs">
        <Group justify="space-between">
          <Title order={3} size="h4">
            {group.name}
          </Title>
          {mayEdit && (
            <Button size="compact-sm" variant="default" onClick={open} aria-label={`Edit ${group.name}`}>
              Edit
            </Button>
          )}
        </Group>
        {editing && <EditGroupModal labId={labId} group={group} datasets={datasets} onClose={close} />}
        {group.description && <Text size="sm">{group.description}</Text>}
        <Table>
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Version</Table.Th>
              <Table.Th>Members</Table.Th>
              <Table.Th>Built</Table.Th>
              <Table.Th>Approval</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {group.versions.map((version) => (
              <Table.Tr key={version.id}>
                <Table.Td>v{version.number}</Table.Td>
                <Table.Td>{version.memberIds.length}</Table.Td>
                <Table.Td>
                  {version.source === 'column' ? 'From the group column' : 'By hand'},{' '}
                  {dateFormat.format(new Date(version.createdAt))}
                  {version.createdBy && ` by ${version.createdBy}`}
                </Table.Td>
                <Table.Td>
                  {version.approvedAt ? (
                    // The approver's name beside the badge, not in it: a badge cuts long names off.
                    <Stack gap={2} align="flex-start">
                      <Badge color="teal" variant="light" miw="max-content">
                        Approved
                      </Badge>
                      <Text size="xs" c="dimmed">
                        by {version.approvedBy ?? 'a former member'}
                      </Text>
                    </Stack>
                  ) : mayEdit ? (
                    <Button
                      size="compact-sm"
                      variant="light"
                      loading={approve.isPending && approve.variables?.versionId === version.id}
                      onClick={() => approve.mutate({ groupId: group.id, versionId: version.id })}
                    >
                      Approve v{version.number}
                    </Button>
                  ) : (
                    <Badge color="gray" variant="light">
                      Not approved
                    </Badge>
                  )}
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
        {approve.isError && (
          <Text c="red" size="sm">
            {errorMessage(approve.error)}
          </Text>
        )}
      </Stack>
    </Card>
  );
}

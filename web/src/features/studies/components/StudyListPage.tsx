import { Alert, Anchor, Button, Group, Loader, Stack, Table, Text, Title } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import type { LabRole } from '@provenote/shared/schemas';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { LabGuide } from '../../onboarding/components/LabGuide';
import { useStudyList } from '../api/studies';
import { CreateStudyModal } from './CreateStudyModal';
import { StudyStatusBadge } from './StudyStatusBadge';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

// The study name and description take the room left; the short columns keep to one line at laptop width.
const noWrap = { whiteSpace: 'nowrap' } as const;

export const studyPath = (labId: string, studyId: string) => `/labs/${labId}/studies/${studyId}`;

/** The home page: the studies of the lab in the address, or of the person's first lab. */
export function StudyListPage() {
  const { labId: labInPath } = useParams();
  const me = useMe();
  const membership = labInPath ? me.data?.memberships.find((m) => m.labId === labInPath) : me.data?.memberships[0];
  const labId = labInPath ?? membership?.labId;
  return (
    <Stack maw={1100}>
      <Title order={2}>Studies</Title>
      {me.isPending && !labInPath && <Loader size="sm" aria-label="Loading your labs" />}
      {me.isError && !labInPath && <Alert color="red">Could not load your labs: {errorMessage(me.error)}</Alert>}
      {me.isSuccess && !labId && (
        <Text c="dimmed">
          You are not a member of any lab yet. Ask a PI for an invitation, or start a lab of your own.
        </Text>
      )}
      {labId && <StudyTable labId={labId} role={membership?.role} />}
    </Stack>
  );
}

function StudyTable({ labId, role }: { labId: string; role: LabRole | undefined }) {
  const canCreate = role !== 'guest';
  const studies = useStudyList(labId);
  const navigate = useNavigate();
  const [opened, { open, close }] = useDisclosure(false);
  return (
    <>
      <Group justify="space-between">
        <Text c="dimmed">
          Each study reads top to bottom: data, preparation, groups, check, assignment, review, export.
        </Text>
        {canCreate && <Button onClick={open}>New study</Button>}
      </Group>
      <CreateStudyModal
        labId={labId}
        opened={opened}
        onClose={close}
        onCreated={(study) => navigate(studyPath(labId, study.id))}
      />
      {studies.isPending && <Loader size="sm" aria-label="Loading studies" />}
      {studies.isError && <Alert color="red">Could not load the studies: {errorMessage(studies.error)}</Alert>}
      {studies.isSuccess && studies.data.studies.length === 0 && <LabGuide labId={labId} role={role} />}
      {studies.isSuccess && studies.data.studies.length > 0 && (
        <Table striped highlightOnHover aria-label="Studies of this lab">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Study</Table.Th>
              <Table.Th w={1}>Status</Table.Th>
              <Table.Th style={noWrap}>Owner</Table.Th>
              <Table.Th style={noWrap}>Last change</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {studies.data.studies.map((study) => (
              <Table.Tr key={study.id}>
                <Table.Td>
                  <Anchor component={Link} to={studyPath(labId, study.id)}>
                    {study.name}
                  </Anchor>
                  {study.description && (
                    <Text size="xs" c="dimmed" lineClamp={1}>
                      {study.description}
                    </Text>
                  )}
                </Table.Td>
                <Table.Td>
                  <StudyStatusBadge status={study.status} />
                </Table.Td>
                <Table.Td style={noWrap}>{study.owner?.displayName ?? '—'}</Table.Td>
                <Table.Td style={noWrap}>{dateFormat.format(new Date(study.updatedAt))}</Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </>
  );
}

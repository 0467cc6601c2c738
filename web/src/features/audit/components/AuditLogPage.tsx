import { Alert, Button, Code, Loader, Stack, Table, Text, Title } from '@mantine/core';
import { useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { PiOnlyPage } from '../../../components/PiOnlyPage';
import { useAuditLog } from '../api/audit';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'medium' });

/** Who did what in the lab, newest first (PI only; the API refuses everyone else). */
export function AuditLogPage() {
  const { labId = '' } = useParams();
  const me = useMe();
  if (me.isPending) return <Loader size="sm" aria-label="Loading" />;
  if (me.data?.memberships.find((m) => m.labId === labId)?.role !== 'pi')
    return <PiOnlyPage labId={labId} title="Audit log" />;
  return <AuditLogPageContent labId={labId} />;
}

function AuditLogPageContent({ labId }: { labId: string }) {
  const audit = useAuditLog(labId);
  const events = audit.data?.pages.flatMap((page) => page.events) ?? [];
  return (
    <Stack maw={1100}>
      <Title order={2}>Audit log</Title>
      <Text c="dimmed">Membership changes, approvals, sign-offs, exports and deletions in this lab.</Text>
      {audit.isPending && <Loader size="sm" aria-label="Loading the audit log" />}
      {audit.isError && <Alert color="red">{errorMessage(audit.error)}</Alert>}
      {audit.isSuccess && events.length === 0 && <Text>Nothing has been recorded yet.</Text>}
      {events.length > 0 && (
        <Table striped aria-label="Audit log">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>When</Table.Th>
              <Table.Th>Who</Table.Th>
              <Table.Th>What</Table.Th>
              <Table.Th>Details</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {events.map((event) => (
              <Table.Tr key={event.id}>
                <Table.Td>{dateFormat.format(new Date(event.createdAt))}</Table.Td>
                <Table.Td>{event.actor.displayName ?? event.actor.email ?? 'Provenote'}</Table.Td>
                <Table.Td>{event.action}</Table.Td>
                <Table.Td>
                  {Object.keys(event.details).length > 0 && <Code>{JSON.stringify(event.details)}</Code>}
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
      {audit.hasNextPage && (
        <Button variant="light" loading={audit.isFetchingNextPage} onClick={() => void audit.fetchNextPage()}>
          Older entries
        </Button>
      )}
    </Stack>
  );
}

import { Accordion, Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { PiOnlyPage } from '../../../components/PiOnlyPage';
import { useOutbox } from '../api/outbox';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'medium' });
const linkPattern = /(https?:\/\/\S+)/g;

/** Read-only: the mails this local installation "sent" for the lab, so their links can be followed. */
export function OutboxPage() {
  const { labId = '' } = useParams();
  const me = useMe();
  if (me.isPending) return <Loader size="sm" aria-label="Loading" />;
  if (me.data?.memberships.find((m) => m.labId === labId)?.role !== 'pi')
    return <PiOnlyPage labId={labId} title="Outbox" />;
  return <OutboxPageContent labId={labId} />;
}

function OutboxPageContent({ labId }: { labId: string }) {
  const outbox = useOutbox(labId);
  return (
    <Stack maw={900}>
      <Title order={2}>Outbox</Title>
      <Text c="dimmed">
        This installation delivers mail to a built-in test server instead of real inboxes. Invitations and run notices
        for this lab appear here; personal mails such as password resets appear only in the server log.
      </Text>
      {outbox.isPending && <Loader size="sm" aria-label="Loading the outbox" />}
      {outbox.isError && <Alert color="red">{errorMessage(outbox.error)}</Alert>}
      {outbox.data?.length === 0 && <Text>No mail yet.</Text>}
      {outbox.data && outbox.data.length > 0 && (
        <Accordion variant="separated">
          {outbox.data.map((mail) => (
            <Accordion.Item key={mail.id} value={mail.id}>
              <Accordion.Control>
                <Text fw={700}>{mail.subject}</Text>
                <Text size="sm" c="dimmed">
                  to {mail.to.join(', ')} · {dateFormat.format(new Date(mail.receivedAt))}
                </Text>
              </Accordion.Control>
              <Accordion.Panel>
                <Text style={{ whiteSpace: 'pre-wrap' }}>
                  {mail.text.split(linkPattern).map((part, index) =>
                    index % 2 === 1 ? (
                      <a key={index} href={part}>
                        {part}
                      </a>
                    ) : (
                      part
                    ),
                  )}
                </Text>
              </Accordion.Panel>
            </Accordion.Item>
          ))}
        </Accordion>
      )}
    </Stack>
  );
}

import { Alert, Badge, Button, Group, Select, Stack, Table, Text, TextInput, Title } from '@mantine/core';
import { schemaResolver, useForm } from '@mantine/form';
import { inviteSchema, labRoleDescriptions, labRoles, type Invite } from '@provenote/shared/schemas';
import { errorMessage, fieldErrors } from '../../../app/api-client';
import { useInvitations, useInvite, useResendInvitation, useRevokeInvitation } from '../api/invitations';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** The PI's part of the members page: inviting by e-mail, and the invitations not accepted yet. */
export function InvitationsPanel({ labId }: { labId: string }) {
  const invitations = useInvitations(labId, true);
  const invite = useInvite(labId);
  const resend = useResendInvitation(labId);
  const revoke = useRevokeInvitation(labId);
  const form = useForm<Invite>({
    initialValues: { email: '', role: 'student' },
    validate: schemaResolver(inviteSchema, { sync: true }),
  });
  const failed = [invite, resend, revoke].find((mutation) => mutation.isError);
  return (
    <Stack>
      <Title order={3} id="invite-title">
        Invite someone
      </Title>
      <form
        aria-labelledby="invite-title"
        noValidate
        onSubmit={form.onSubmit((values) =>
          invite.mutate(inviteSchema.parse(values), {
            onSuccess: () => form.reset(),
            onError: (error) => form.setErrors(fieldErrors(error)),
          }),
        )}
      >
        <Group align="flex-start">
          {/* Labels of their own: the members table above has a "Role of …" selector per member. */}
          <TextInput label="E-mail to invite" type="email" required w={300} {...form.getInputProps('email')} />
          <Select
            label="Invite as"
            w={220}
            allowDeselect={false}
            description={labRoleDescriptions[form.values.role].description}
            data={labRoles.map((role) => ({ value: role, label: labRoleDescriptions[role].label }))}
            {...form.getInputProps('role')}
          />
          <Button type="submit" mt={25} loading={invite.isPending}>
            Send invitation
          </Button>
        </Group>
      </form>
      {failed && <Alert color="red">{errorMessage(failed.error)}</Alert>}
      <Title order={3}>Pending invitations</Title>
      {invitations.isError && <Alert color="red">{errorMessage(invitations.error)}</Alert>}
      {invitations.data?.length === 0 && <Text c="dimmed">No invitation is waiting for an answer.</Text>}
      {invitations.data && invitations.data.length > 0 && (
        <Table aria-label="Pending invitations">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>E-mail</Table.Th>
              <Table.Th>Role</Table.Th>
              <Table.Th>Invited by</Table.Th>
              <Table.Th>Sent</Table.Th>
              <Table.Th aria-label="Actions" />
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {invitations.data.map((invitation) => (
              <Table.Tr key={invitation.id}>
                <Table.Td>{invitation.email}</Table.Td>
                <Table.Td>{labRoleDescriptions[invitation.role].label}</Table.Td>
                <Table.Td>{invitation.invitedBy ?? '—'}</Table.Td>
                <Table.Td>
                  {dateFormat.format(new Date(invitation.sentAt))}{' '}
                  {new Date(invitation.expiresAt) < new Date() && <Badge color="gray">link expired</Badge>}
                </Table.Td>
                <Table.Td>
                  <Group gap="xs">
                    <Button size="xs" variant="light" onClick={() => resend.mutate(invitation.id)}>
                      Resend
                    </Button>
                    <Button size="xs" variant="subtle" color="red" onClick={() => revoke.mutate(invitation.id)}>
                      Revoke
                    </Button>
                  </Group>
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
    </Stack>
  );
}

import { Alert, List, Loader, Stack, Text, Title } from '@mantine/core';
import { labRoleDescriptions, labRoles } from '@provenote/shared/schemas';
import { useParams } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { useChangeRole, useMembers, useRemoveMember } from '../api/members';
import { InvitationsPanel } from './InvitationsPanel';
import { MembersTable } from './MembersTable';

export function MembersPage() {
  const { labId = '' } = useParams();
  const me = useMe();
  const members = useMembers(labId);
  const changeRole = useChangeRole(labId);
  const remove = useRemoveMember(labId);
  const membership = me.data?.memberships.find((m) => m.labId === labId);
  const isPi = membership?.role === 'pi';
  const failed = changeRole.isError ? changeRole.error : remove.isError ? remove.error : null;
  return (
    <Stack maw={1000}>
      <Title order={2}>Lab members</Title>
      {membership && <Text c="dimmed">{membership.labName}</Text>}
      {members.isPending && <Loader size="sm" aria-label="Loading members" />}
      {members.isError && <Alert color="red">Could not load the members: {errorMessage(members.error)}</Alert>}
      {failed && <Alert color="red">{errorMessage(failed)}</Alert>}
      {members.data && me.data && (
        <MembersTable
          members={members.data}
          currentUserId={me.data.user.id}
          canManage={isPi}
          busy={changeRole.isPending || remove.isPending}
          onChangeRole={(member, role) => changeRole.mutate({ membershipId: member.membershipId, role })}
          onRemove={(member) => {
            if (window.confirm(`Remove ${member.displayName} from the lab?`)) remove.mutate(member.membershipId);
          }}
        />
      )}
      <Title order={3}>What each role may do</Title>
      <List>
        {labRoles.map((role) => (
          <List.Item key={role}>
            <b>{labRoleDescriptions[role].label}</b>: {labRoleDescriptions[role].description}
          </List.Item>
        ))}
      </List>
      {isPi && <InvitationsPanel labId={labId} />}
    </Stack>
  );
}

import { Button, NativeSelect, Table, Text } from '@mantine/core';
import { labRoleDescriptions, labRoles, type LabRole, type Member } from '@provenote/shared/schemas';

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });
const roleOptions = labRoles.map((role) => ({ value: role, label: labRoleDescriptions[role].label }));

export interface MembersTableProps {
  members: Member[];
  /** The signed-in person, marked "you" in the table. */
  currentUserId: string;
  /** Only a PI changes roles and removes people; everyone else sees the list read-only. */
  canManage: boolean;
  busy?: boolean;
  onChangeRole: (member: Member, role: LabRole) => void;
  onRemove: (member: Member) => void;
}

export function MembersTable({ members, currentUserId, canManage, busy, onChangeRole, onRemove }: MembersTableProps) {
  return (
    <Table striped highlightOnHover aria-label="Lab members">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Name</Table.Th>
          <Table.Th>E-mail</Table.Th>
          <Table.Th>Role</Table.Th>
          <Table.Th>Member since</Table.Th>
          {canManage && <Table.Th aria-label="Actions" />}
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {members.map((member) => {
          const you = member.userId === currentUserId;
          return (
            <Table.Tr key={member.membershipId}>
              <Table.Td>
                {member.displayName}
                {you && (
                  <Text span c="dimmed" size="sm">
                    {' '}
                    (you)
                  </Text>
                )}
              </Table.Td>
              <Table.Td>{member.email}</Table.Td>
              <Table.Td>
                {canManage ? (
                  <NativeSelect
                    aria-label={`Role of ${member.displayName}`}
                    size="xs"
                    w={200}
                    disabled={busy}
                    data={roleOptions}
                    value={member.role}
                    onChange={(event) => {
                      const role = event.currentTarget.value as LabRole;
                      if (role !== member.role) onChangeRole(member, role);
                    }}
                  />
                ) : (
                  labRoleDescriptions[member.role].label
                )}
              </Table.Td>
              <Table.Td>{dateFormat.format(new Date(member.joinedAt))}</Table.Td>
              {canManage && (
                <Table.Td>
                  <Button
                    size="xs"
                    variant="subtle"
                    color="red"
                    disabled={busy}
                    aria-label={`Remove ${member.displayName}`}
                    onClick={() => onRemove(member)}
                  >
                    {you ? 'Leave' : 'Remove'}
                  </Button>
                </Table.Td>
              )}
            </Table.Tr>
          );
        })}
      </Table.Tbody>
    </Table>
  );
}

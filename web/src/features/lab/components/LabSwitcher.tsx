import { Group, Select, Text } from '@mantine/core';
import { labRoleDescriptions } from '@provenote/shared/schemas';
import { useNavigate, useParams } from 'react-router-dom';
import { useMe } from '../../../app/session';

/** The lab the screens show; switching keeps nothing of the previous lab on screen. */
export function LabSwitcher() {
  const me = useMe();
  const { labId } = useParams();
  const navigate = useNavigate();
  const memberships = me.data?.memberships ?? [];
  if (memberships.length === 0) return null;
  const current = labId ?? memberships[0].labId;
  const membership = memberships.find((m) => m.labId === current);
  return (
    // The role sits beside the field rather than in it, so a lab name of about 45 characters fits at 1024 px.
    <Group gap="xs" wrap="nowrap">
      <Select
        aria-label="Lab"
        w={380}
        title={membership?.labName}
        comboboxProps={{ width: 'max-content' }}
        allowDeselect={false}
        value={current}
        data={memberships.map((m) => ({ value: m.labId, label: m.labName }))}
        onChange={(value) => value && value !== current && navigate(`/labs/${value}`)}
      />
      {membership && (
        <Text size="sm" c="dimmed" style={{ whiteSpace: 'nowrap' }}>
          {labRoleDescriptions[membership.role].label}
        </Text>
      )}
    </Group>
  );
}

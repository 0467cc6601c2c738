import { Select } from '@mantine/core';
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
  return (
    <Select
      aria-label="Lab"
      w={300}
      allowDeselect={false}
      value={current}
      data={memberships.map((m) => ({
        value: m.labId,
        label: `${m.labName} · ${labRoleDescriptions[m.role].label}`,
      }))}
      onChange={(value) => value && value !== current && navigate(`/labs/${value}`)}
    />
  );
}

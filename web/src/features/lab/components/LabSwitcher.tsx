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
  const options = memberships.map((m) => ({
    value: m.labId,
    label: `${m.labName} · ${labRoleDescriptions[m.role].label}`,
  }));
  return (
    <Select
      aria-label="Lab"
      // Wide enough for a lab name of about fifty characters with the role at 1024 px; longer ones show in full on hover.
      w={460}
      title={options.find((o) => o.value === current)?.label}
      comboboxProps={{ width: 'max-content' }}
      allowDeselect={false}
      value={current}
      data={options}
      onChange={(value) => value && value !== current && navigate(`/labs/${value}`)}
    />
  );
}

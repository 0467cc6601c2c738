import { Button, Group, MultiSelect, Stack, Table, Text } from '@mantine/core';
import { useState } from 'react';
import type { StepParameters } from '@provenote/shared/schemas';
import { useGroupList } from '../../../groups/api/groups';
import { useGroupSizes } from '../../api/group-sizes';
import { GroupSizeAlerts } from '../GroupSizeAlerts';
import { stepParameters, type CardProps } from './card-props';

export function GroupsCard({ labId, study, step, readOnly, onSave, saving, errors }: CardProps) {
  const saved = step.parameters as StepParameters['groups'] | null;
  const [chosen, setChosen] = useState<string[]>(saved?.groupVersionIds ?? []);
  const referenceId = stepParameters<StepParameters['data']>(study, 'data')?.referenceVersionId;
  const groups = useGroupList(labId);
  const options = (groups.data?.groups ?? []).flatMap((g) =>
    g.versions
      .filter((v) => v.datasetVersionId === referenceId)
      .map((v) => ({
        value: v.id,
        label: `${g.name} v${v.number} — ${v.memberIds.length} members${v.approvedAt ? ', approved' : ', not approved'}`,
      })),
  );
  const sizes = useGroupSizes(labId, study.id, step.updatedAt, saved !== null);

  return (
    <Stack gap="sm">
      {groups.isSuccess && options.length === 0 && (
        <Text size="sm">
          No reference groups are built from this study's reference data yet. Build them under Reference groups (from
          the dataset's group column, or by choosing samples).
        </Text>
      )}
      <MultiSelect
        label="Reference groups"
        description="One version per group; students may choose approved versions only."
        data={options}
        value={chosen}
        onChange={setChosen}
        disabled={readOnly}
        error={errors.groupVersionIds}
        searchable
      />
      {!readOnly && (
        <Group>
          <Button onClick={() => onSave({ groupVersionIds: chosen })} loading={saving}>
            Save groups
          </Button>
        </Group>
      )}
      {sizes.data && sizes.data.groups.length > 0 && (
        <Table aria-label="Group sizes against the number of variables">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Group</Table.Th>
              <Table.Th>Members n</Table.Th>
              <Table.Th>Variables p</Table.Th>
              <Table.Th>False rejections of the χ² rule at α</Table.Th>
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {sizes.data.groups.map((g) => (
              <Table.Tr key={g.group}>
                <Table.Td>{g.group}</Table.Td>
                <Table.Td>{g.n}</Table.Td>
                <Table.Td>{g.p}</Table.Td>
                <Table.Td>
                  {g.chiSquareFalseRejectionRate === null
                    ? '—'
                    : `${(100 * g.chiSquareFalseRejectionRate).toFixed(1)} %`}
                </Table.Td>
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
      {sizes.data && (
        <GroupSizeAlerts
          sizes={sizes.data}
          basis={stepParameters<StepParameters['assign']>(study, 'assign')?.probability ?? 'hotelling'}
        />
      )}
    </Stack>
  );
}

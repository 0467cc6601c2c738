import { Drawer, Stack, Table, Text, Title } from '@mantine/core';
import type { AssignmentRow, AssignmentsPage } from '@provenote/shared/schemas';
import { formatOptionalProbability, formatProbability as fmt } from '../../../lib/probability';
import { EvidenceCaution } from './EvidenceCaution';
import { OverrideForm } from './OverrideForm';

interface Props {
  labId: string;
  studyId: string;
  canOverride: boolean;
  row: AssignmentRow | null;
  groups: AssignmentsPage['groups'];
  variables: string[];
  onClose: () => void;
}

/** One unknown in detail: its probability for every group and which elements drive its distance. */
export function AssignmentDrawer({ labId, studyId, canOverride, row, groups, variables, onClose }: Props) {
  return (
    <Drawer
      opened={row !== null}
      onClose={onClose}
      position="right"
      size="lg"
      title={row ? `Sample ${row.sampleId}` : ''}
    >
      {row && (
        <Stack>
          <Text>
            Verdict <b>{row.verdict}</b>; best group <b>{row.group}</b> ({fmt(row.probability)})
            {row.runnerUp && `, runner-up ${row.runnerUp} (${formatOptionalProbability(row.runnerUpProbability)})`}.
          </Text>
          <EvidenceCaution />
          <OverrideForm
            key={row.sampleId}
            labId={labId}
            studyId={studyId}
            row={row}
            groups={groups.map((g) => g.name)}
            canOverride={canOverride}
          />
          <Title order={4}>Every group</Title>
          <Table aria-label="Distance and probabilities per group">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Group</Table.Th>
                <Table.Th>n</Table.Th>
                <Table.Th ta="right">D²</Table.Th>
                <Table.Th ta="right">p (χ²)</Table.Th>
                <Table.Th ta="right">p (Hotelling)</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {groups.map((g, i) => (
                <Table.Tr key={g.name}>
                  <Table.Td>{g.name}</Table.Td>
                  <Table.Td>{g.effectiveN}</Table.Td>
                  <Table.Td ta="right">{row.d2[i].toFixed(3)}</Table.Td>
                  <Table.Td ta="right">{fmt(row.pChi2[i])}</Table.Td>
                  <Table.Td ta="right">{fmt(row.pHotelling[i])}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
          <Title order={4}>What drives the distance to {row.group}</Title>
          <Table aria-label="Contributions to D² per element">
            <Table.Thead>
              <Table.Tr>
                <Table.Th>Coordinate</Table.Th>
                <Table.Th ta="right">Contribution to D²</Table.Th>
              </Table.Tr>
            </Table.Thead>
            <Table.Tbody>
              {variables.map((v, i) => (
                <Table.Tr key={v}>
                  <Table.Td>{v}</Table.Td>
                  <Table.Td ta="right">{row.contributions[i].toFixed(3)}</Table.Td>
                </Table.Tr>
              ))}
            </Table.Tbody>
          </Table>
        </Stack>
      )}
    </Drawer>
  );
}

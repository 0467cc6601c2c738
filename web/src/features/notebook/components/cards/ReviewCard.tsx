import { Alert, Button, Stack, Table, Text, Textarea } from '@mantine/core';
import { useState } from 'react';
import type { Study } from '@provenote/shared/schemas';
import { useOverrides } from '../../api/overrides';
import { EvidenceCaution } from '../EvidenceCaution';

interface Props {
  labId: string;
  study: Study;
  isPi: boolean;
  blocker: string | null;
  onSignOff: (statement: string) => void;
  signing: boolean;
  error: string | null;
}

/** Review: the PI's sign-off, which locks every card of the study. */
export function ReviewCard({ labId, study, isPi, blocker, onSignOff, signing, error }: Props) {
  const [statement, setStatement] = useState('');
  const overrides = useOverrides(labId, study.id);
  const list = overrides.data?.overrides ?? [];
  const overrideTable = list.length > 0 && (
    <Table aria-label="Overridden verdicts">
      <Table.Thead>
        <Table.Tr>
          <Table.Th>Sample</Table.Th>
          <Table.Th>Computed</Table.Th>
          <Table.Th>Final</Table.Th>
          <Table.Th>Reason</Table.Th>
          <Table.Th>By</Table.Th>
        </Table.Tr>
      </Table.Thead>
      <Table.Tbody>
        {list.map((o) => (
          <Table.Tr key={o.id}>
            <Table.Td>{o.sampleId}</Table.Td>
            <Table.Td>{[o.computedVerdict, o.computedGroup].filter(Boolean).join(': ')}</Table.Td>
            <Table.Td>{[o.verdict, o.group].filter(Boolean).join(': ')}</Table.Td>
            <Table.Td>{o.reason}</Table.Td>
            <Table.Td>{o.createdBy ?? '—'}</Table.Td>
          </Table.Tr>
        ))}
      </Table.Tbody>
    </Table>
  );
  if (study.signedOffAt) {
    return (
      <Stack gap="sm">
        <Alert color="grape" title="Signed off">
          Signed off by {study.signedOffBy ?? 'a former member'} on {new Date(study.signedOffAt).toLocaleString()}.
          Inputs, settings and results are locked; copy the study to work on it further.
        </Alert>
        {overrideTable}
      </Stack>
    );
  }
  return (
    <Stack gap="sm">
      <EvidenceCaution />
      <Text size="sm">
        {list.length === 0
          ? 'No verdict is overridden. Open a sample in the Assign card to set a final verdict with a reason.'
          : `${list.length} verdict${list.length === 1 ? '' : 's'} overridden:`}
      </Text>
      {overrideTable}
      {isPi ? (
        <>
          <Textarea
            label="Sign-off statement"
            description="Optional: what was checked, kept with the signature."
            value={statement}
            onChange={(e) => setStatement(e.currentTarget.value)}
            resize="vertical"
            rows={2}
          />
          <Button onClick={() => onSignOff(statement)} loading={signing} disabled={blocker !== null} w="fit-content">
            Sign off this study
          </Button>
          {error && (
            <Text c="red" size="sm">
              {error}
            </Text>
          )}
        </>
      ) : (
        <Text size="sm">The lab's PI signs the study off when the assignments have been reviewed.</Text>
      )}
    </Stack>
  );
}

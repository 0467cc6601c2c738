import { ActionIcon, Button, Group, Select, Stack, Table, Text, Textarea } from '@mantine/core';
import { useRef, useState } from 'react';
import type { MemberExclusion, StepParameters } from '@provenote/shared/schemas';
import { CheckResults } from '../CheckResults';
import type { CardProps } from './card-props';

interface Props extends CardProps {
  /** Analysts and PIs vet the groups: only they exclude members. */
  mayExclude: boolean;
  /** Why this person may not run the check (a student, before every chosen group is approved), or null. */
  runRefusal: string | null;
  onRun: () => void;
  running: boolean;
  runBlocked: boolean;
  memberOptions: { value: string; label: string; group: string }[];
}

/** The group check: run leave-one-out on the queue, and exclude members with a written reason. */
export function CheckCard({
  labId,
  study,
  step,
  readOnly,
  onSave,
  saving,
  errors,
  mayExclude,
  runRefusal,
  onRun,
  running,
  runBlocked,
  memberOptions,
}: Props) {
  const saved = (step.parameters as StepParameters['check'] | null)?.exclusions ?? [];
  const [member, setMember] = useState<string | null>(null);
  const [reason, setReason] = useState('');
  const reasonField = useRef<HTMLTextAreaElement>(null);
  const editable = !readOnly && mayExclude;
  const save = (exclusions: MemberExclusion[]) => onSave({ exclusions });
  const chosen = memberOptions.find((o) => o.value === member);

  return (
    <Stack gap="sm">
      {!readOnly && (
        <Group>
          <Button onClick={onRun} loading={running} disabled={runBlocked || runRefusal !== null}>
            {step.status === 'not_run' ? 'Run group check' : 'Run group check again'}
          </Button>
          {runRefusal && <Text size="sm">{runRefusal}</Text>}
          {!runRefusal && !mayExclude && (
            <Text size="sm" c="dimmed">
              The check only computes; analysts and PIs exclude members.
            </Text>
          )}
        </Group>
      )}
      {step.runId && (step.status === 'current' || step.status === 'stale') && (
        <CheckResults
          labId={labId}
          studyId={study.id}
          runId={step.runId}
          onExclude={
            editable
              ? ({ sampleId, group }) => {
                  setMember(`${group}\u0000${sampleId}`);
                  // The reason is the part that needs a person: take them straight to it.
                  reasonField.current?.focus();
                }
              : undefined
          }
        />
      )}
      <Text fw={500} size="sm">
        Excluded members ({saved.length})
      </Text>
      {saved.length === 0 ? (
        <Text size="sm" c="dimmed">
          No member is excluded. Exclude a member only with a reason someone else can check later.
        </Text>
      ) : (
        <Table aria-label="Excluded members">
          <Table.Thead>
            <Table.Tr>
              <Table.Th>Sample</Table.Th>
              <Table.Th>Group</Table.Th>
              <Table.Th>Reason</Table.Th>
              {editable && <Table.Th aria-label="Actions" />}
            </Table.Tr>
          </Table.Thead>
          <Table.Tbody>
            {saved.map((e) => (
              <Table.Tr key={`${e.group}/${e.sampleId}`}>
                <Table.Td>{e.sampleId}</Table.Td>
                <Table.Td>{e.group}</Table.Td>
                <Table.Td>{e.reason}</Table.Td>
                {editable && (
                  <Table.Td>
                    <ActionIcon
                      variant="subtle"
                      aria-label={`Put ${e.sampleId} back into ${e.group}`}
                      onClick={() => save(saved.filter((x) => x !== e))}
                    >
                      ↺
                    </ActionIcon>
                  </Table.Td>
                )}
              </Table.Tr>
            ))}
          </Table.Tbody>
        </Table>
      )}
      {editable && (
        <Stack gap="xs">
          <Select
            label="Member to exclude"
            // Mantine reads an option with a `group` key as a group of options, so only value and label go in.
            data={memberOptions.map(({ value, label }) => ({ value, label }))}
            value={member}
            onChange={setMember}
            searchable
            clearable
          />
          <Textarea
            ref={reasonField}
            label="Reason"
            description="Kept in the study's record, e.g. a field note or a lab log entry."
            value={reason}
            onChange={(e) => setReason(e.currentTarget.value)}
            error={errors['exclusions']}
            resize="vertical"
            rows={2}
          />
          <Group>
            <Button
              variant="light"
              disabled={!chosen}
              loading={saving}
              onClick={() =>
                chosen && save([...saved, { sampleId: chosen.value.split('\u0000')[1], group: chosen.group, reason }])
              }
            >
              Exclude member
            </Button>
          </Group>
        </Stack>
      )}
    </Stack>
  );
}

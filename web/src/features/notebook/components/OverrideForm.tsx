import { Button, Select, Stack, Text, Textarea, Title } from '@mantine/core';
import { useState } from 'react';
import {
  assignmentVerdicts,
  createOverrideSchema,
  type AssignmentRow,
  type AssignmentVerdict,
} from '@provenote/shared/schemas';
import { errorMessage } from '../../../app/api-client';
import { useCreateOverride, useOverrides } from '../api/overrides';

interface Props {
  labId: string;
  studyId: string;
  row: AssignmentRow;
  groups: string[];
  /** Analysts and PIs on a study that is not signed off. */
  canOverride: boolean;
}

/** The analyst's final verdict for one unknown, with the reason; the computed verdict stays beside it. */
export function OverrideForm({ labId, studyId, row, groups, canOverride }: Props) {
  const overrides = useOverrides(labId, studyId);
  const existing = overrides.data?.overrides.find((o) => o.sampleId === row.sampleId);
  const create = useCreateOverride(labId, studyId);
  const [verdict, setVerdict] = useState<AssignmentVerdict>(existing?.verdict ?? row.verdict);
  const [group, setGroup] = useState<string | null>(
    existing?.group ?? (row.verdict === 'unassigned' ? null : row.group),
  );
  const [reason, setReason] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});

  const submit = () => {
    const input = { sampleId: row.sampleId, verdict, group: verdict === 'unassigned' ? null : group, reason };
    const parsed = createOverrideSchema.safeParse(input);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setErrors({});
    create.mutate(parsed.data, { onSuccess: () => setReason('') });
  };

  return (
    <Stack gap="xs">
      <Title order={4}>Final verdict</Title>
      {existing ? (
        <Text size="sm">
          Overridden by {existing.createdBy ?? 'a former member'}: <b>{existing.verdict}</b>
          {existing.group && ` to ${existing.group}`} (computed: {existing.computedVerdict}
          {existing.computedGroup && ` to ${existing.computedGroup}`}). Reason: {existing.reason}
        </Text>
      ) : (
        <Text size="sm">The final verdict is the computed one.</Text>
      )}
      {canOverride && (
        <>
          <Select
            label="Verdict"
            data={[...assignmentVerdicts]}
            value={verdict}
            onChange={(v) => v && setVerdict(v as AssignmentVerdict)}
            allowDeselect={false}
          />
          {verdict !== 'unassigned' && (
            <Select label="Group" data={groups} value={group} onChange={setGroup} error={errors.group} />
          )}
          <Textarea
            label="Reason"
            description="Kept in the study's record beside the computed verdict."
            value={reason}
            onChange={(e) => setReason(e.currentTarget.value)}
            error={errors.reason}
            resize="vertical"
            rows={2}
          />
          {create.isError && (
            <Text c="red" size="sm">
              {errorMessage(create.error)}
            </Text>
          )}
          <Button onClick={submit} loading={create.isPending} w="fit-content">
            Save final verdict
          </Button>
        </>
      )}
    </Stack>
  );
}

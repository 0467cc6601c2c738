import { Alert, Button, Stack, Text, Textarea } from '@mantine/core';
import { useState } from 'react';
import type { Study } from '@provenote/shared/schemas';
import { EvidenceCaution } from '../EvidenceCaution';

interface Props {
  study: Study;
  isPi: boolean;
  blocker: string | null;
  onSignOff: (statement: string) => void;
  signing: boolean;
  error: string | null;
}

/** Review: the PI's sign-off, which locks every card of the study. */
export function ReviewCard({ study, isPi, blocker, onSignOff, signing, error }: Props) {
  const [statement, setStatement] = useState('');
  if (study.signedOffAt) {
    return (
      <Alert color="grape" title="Signed off">
        Signed off by {study.signedOffBy ?? 'a former member'} on {new Date(study.signedOffAt).toLocaleString()}.
        Inputs, settings and results are locked; copy the study to work on it further.
      </Alert>
    );
  }
  return (
    <Stack gap="sm">
      <EvidenceCaution />
      {isPi ? (
        <>
          <Textarea
            label="Sign-off statement"
            description="Optional: what was checked, kept with the signature."
            value={statement}
            onChange={(e) => setStatement(e.currentTarget.value)}
            autosize
            minRows={2}
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

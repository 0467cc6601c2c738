import { Alert } from '@mantine/core';

/** Shown wherever verdicts appear: a probability supports an interpretation, it does not make one. */
export function EvidenceCaution() {
  return (
    <Alert color="yellow" variant="light" title="Evidence, not proof">
      A membership probability is statistical evidence, not proof of origin; interpretation belongs to the analyst.
    </Alert>
  );
}

import { Badge } from '@mantine/core';
import { studyStatusLabels, type StudyStatus } from '@provenote/shared/schemas';

const colours: Record<StudyStatus, string> = {
  draft: 'gray',
  in_progress: 'blue',
  needs_rerun: 'orange',
  ready_for_review: 'teal',
  signed_off: 'grape',
};

export function StudyStatusBadge({ status }: { status: StudyStatus }) {
  return (
    // Never narrower than its words: a table column would otherwise squeeze it to "IN PROGRE…".
    <Badge color={colours[status]} variant="light" miw="max-content">
      {studyStatusLabels[status]}
    </Badge>
  );
}

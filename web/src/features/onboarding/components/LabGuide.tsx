import { Alert, Anchor, Card, List, Loader, Stack, Text, ThemeIcon, Title, VisuallyHidden } from '@mantine/core';
import type { LabRole } from '@provenote/shared/schemas';
import { Link } from 'react-router-dom';
import { errorMessage } from '../../../app/api-client';
import { EVIDENCE_NOT_PROOF } from '../model/card-help';
import { useLabProgress, type LabProgress } from '../api/lab-progress';

interface GuideStep {
  done: (progress: LabProgress) => boolean;
  title: string;
  text: string;
  link?: { to: (labId: string) => string; label: string; analystOnly: boolean };
}

const steps: GuideStep[] = [
  {
    done: (p) => p.hasReference,
    title: 'Import the reference data',
    text: 'A table of samples of known source: one row per sample, a column naming its source area, one column per element.',
    link: { to: (labId) => `/labs/${labId}/datasets/new`, label: 'Import a file', analystOnly: true },
  },
  {
    done: (p) => p.hasApprovedGroups,
    title: 'Build and approve the reference groups',
    text: 'Make one group per source area from the group column (or pick members by hand), then approve the versions the lab may assign against.',
    link: { to: (labId) => `/labs/${labId}/groups`, label: 'Reference groups', analystOnly: true },
  },
  {
    done: (p) => p.hasUnknowns,
    title: 'Import the unknowns',
    text: 'The samples whose source you want to find, measured on the same elements.',
    link: { to: (labId) => `/labs/${labId}/datasets/new`, label: 'Import a file', analystOnly: false },
  },
  {
    done: (p) => p.hasStudy,
    title: 'Start a study',
    text: 'With “New study” above: choose the data, prepare it, pick the groups, check them, assign the unknowns, review, sign off and export.',
  },
];

const mayImportReference = (role: LabRole | undefined) => role === 'pi' || role === 'analyst';

/** The first-run guide of a lab without studies: what to do, in order, with what is done ticked off. */
export function LabGuide({ labId, role }: { labId: string; role: LabRole | undefined }) {
  const { progress, error } = useLabProgress(labId);
  if (error) return <Alert color="red">Could not load the lab’s data: {errorMessage(error)}</Alert>;
  if (!progress) return <Loader size="sm" aria-label="Loading the lab’s data" />;
  if (progress.hasStudy) return null;
  return (
    <Card withBorder radius="md" padding="lg" component="section" aria-labelledby="lab-guide-title">
      <Stack gap="sm">
        <Title order={3} size="h4" id="lab-guide-title">
          Getting started in this lab
        </Title>
        <Text size="sm" c="dimmed">
          No studies yet. Four steps lead to the first one; each is ticked off here when it is done.
        </Text>
        <List spacing="sm" aria-label="First steps">
          {steps.map((step, index) => {
            const done = step.done(progress);
            const linkAllowed = step.link && (!step.link.analystOnly || mayImportReference(role)) && role !== 'guest';
            return (
              <List.Item
                key={step.title}
                icon={
                  <ThemeIcon size={24} radius="xl" color={done ? 'teal' : 'gray'} variant={done ? 'filled' : 'light'}>
                    <Text size="xs" fw={700} aria-hidden>
                      {done ? '✓' : index + 1}
                    </Text>
                  </ThemeIcon>
                }
              >
                <Text size="sm" fw={600} td={done ? 'line-through' : undefined}>
                  {step.title}
                  {done && <VisuallyHidden> (done)</VisuallyHidden>}
                </Text>
                <Text size="sm" c="dimmed">
                  {step.text}
                </Text>
                {step.link && !done && linkAllowed && (
                  <Anchor component={Link} to={step.link.to(labId)} size="sm">
                    {step.link.label}
                  </Anchor>
                )}
                {step.link?.analystOnly && !done && !linkAllowed && (
                  <Text size="sm" c="dimmed">
                    An analyst or the PI of the lab does this.
                  </Text>
                )}
              </List.Item>
            );
          })}
        </List>
        <Text size="xs" c="dimmed">
          {EVIDENCE_NOT_PROOF}
        </Text>
      </Stack>
    </Card>
  );
}

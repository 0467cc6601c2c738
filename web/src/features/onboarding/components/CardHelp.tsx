import { Accordion, List, Stack, Text } from '@mantine/core';
import type { StepKey } from '@provenote/shared/schemas';
import { cardHelp, EVIDENCE_NOT_PROOF } from '../model/card-help';

/** A closed "How this step works" section: the card's method in plain words, its sources, the caution. */
export function CardHelp({ stepKey }: { stepKey: StepKey }) {
  const { method, references } = cardHelp[stepKey];
  const showCaution = stepKey === 'check' || stepKey === 'assign' || stepKey === 'review';
  return (
    <Accordion variant="default" chevronPosition="left" styles={{ control: { paddingLeft: 0 } }}>
      <Accordion.Item value="help">
        <Accordion.Control>
          <Text size="sm" c="blue.8">
            How this step works
          </Text>
        </Accordion.Control>
        <Accordion.Panel>
          <Stack gap="xs">
            {method.map((paragraph) => (
              <Text key={paragraph} size="sm">
                {paragraph}
              </Text>
            ))}
            {showCaution && (
              <Text size="sm" fw={600}>
                {EVIDENCE_NOT_PROOF}
              </Text>
            )}
            {references.length > 0 && (
              <>
                <Text size="xs" c="dimmed" fw={600}>
                  References
                </Text>
                <List size="xs" c="dimmed" spacing={2}>
                  {references.map((reference) => (
                    <List.Item key={reference}>{reference}</List.Item>
                  ))}
                </List>
              </>
            )}
          </Stack>
        </Accordion.Panel>
      </Accordion.Item>
    </Accordion>
  );
}

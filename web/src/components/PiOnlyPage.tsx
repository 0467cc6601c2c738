import { Button, Stack, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';

/**
 * Shown instead of a PI-only page to anyone else who reaches it by its address, so they learn why and
 * whom to ask rather than meeting a bare refusal from the API.
 */
export function PiOnlyPage({ labId, title }: { labId: string; title: string }) {
  return (
    <Stack maw={560} gap="sm">
      <Title order={2}>{title}</Title>
      <Text>Only the lab&apos;s principal investigator (PI) can see this page.</Text>
      <Text c="dimmed">
        Ask your PI, listed on the Members page, to look at it for you, or to make you the lab&apos;s PI if that is your
        job now.
      </Text>
      <Button component={Link} to={`/labs/${labId}/members`} variant="light" w="fit-content">
        Go to Members
      </Button>
    </Stack>
  );
}

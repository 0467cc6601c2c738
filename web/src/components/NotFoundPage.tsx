import { Button, Stack, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';

export function NotFoundPage() {
  return (
    <Stack maw={520} gap="sm">
      <Title order={2}>Page not found</Title>
      <Text c="dimmed">The address may be mistyped, or the page may belong to a lab you are not a member of.</Text>
      <Button component={Link} to="/" w="fit-content">
        Back to studies
      </Button>
    </Stack>
  );
}

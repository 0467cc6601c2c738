import { Stack, Text, Title } from '@mantine/core';

export function HomePage() {
  return (
    <Stack maw={720}>
      <Title order={2}>Studies</Title>
      <Text c="dimmed">Your lab's studies will be listed here.</Text>
    </Stack>
  );
}

import { Center, Paper, Stack, Title } from '@mantine/core';
import type { ReactNode } from 'react';
import { Logo } from '../../../components/Logo';

/** The centred card every signed-out screen uses. */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Center mih="100vh" bg="tarn.0" p="md">
      <Paper withBorder shadow="sm" p="xl" w={440} radius="lg">
        <Stack>
          <Logo size={36} />
          <Title order={2}>{title}</Title>
          {children}
        </Stack>
      </Paper>
    </Center>
  );
}

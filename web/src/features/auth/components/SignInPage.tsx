import { Button, Center, Paper, PasswordInput, Stack, Text, TextInput, Title } from '@mantine/core';
import { Logo } from '../../../components/Logo';

export function SignInPage() {
  return (
    <Center mih="100vh" bg="tarn.0" p="md">
      <Paper withBorder shadow="sm" p="xl" w={400} radius="lg">
        <Stack>
          <Logo size={36} />
          <Title order={2}>Sign in</Title>
          <Text c="dimmed" size="sm">
            Assign samples of unknown origin to your lab's reference groups.
          </Text>
          <form>
            <Stack>
              <TextInput label="E-mail" type="email" autoComplete="email" required />
              <PasswordInput label="Password" autoComplete="current-password" required />
              <Button type="submit">Sign in</Button>
            </Stack>
          </form>
        </Stack>
      </Paper>
    </Center>
  );
}

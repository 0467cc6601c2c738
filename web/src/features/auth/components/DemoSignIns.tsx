import { Alert, Button, Stack, Text } from '@mantine/core';
import { labRoleDescriptions, type DemoAccounts } from '@provenote/shared/schemas';

/** The demo lab's sign-ins, offered only where the API lists them (a local installation with demo data). */
export function DemoSignIns({
  demo,
  onPick,
}: {
  demo: DemoAccounts;
  onPick: (email: string, password: string) => void;
}) {
  const { password } = demo;
  if (demo.accounts.length === 0 || !password) return null;
  return (
    <Alert color="ochre" title="Demo sign-ins (synthetic demo lab)">
      <Stack gap={6}>
        <Text size="sm">Password for all: {password}</Text>
        {demo.accounts.map((account) => (
          <Button
            key={account.email}
            variant="light"
            size="xs"
            justify="space-between"
            onClick={() => onPick(account.email, password)}
          >
            {labRoleDescriptions[account.role].label}: {account.email}
          </Button>
        ))}
      </Stack>
    </Alert>
  );
}

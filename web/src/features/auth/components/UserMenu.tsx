import { Button, Menu, Text } from '@mantine/core';
import { useNavigate } from 'react-router-dom';
import { useMe } from '../../../app/session';
import { useSignOut } from '../api/sign-in';

export function UserMenu() {
  const me = useMe();
  const navigate = useNavigate();
  const signOut = useSignOut();
  if (!me.data) return null;
  return (
    <Menu position="bottom-end">
      <Menu.Target>
        <Button variant="subtle">{me.data.user.displayName}</Button>
      </Menu.Target>
      <Menu.Dropdown>
        <Menu.Label>
          <Text size="xs">{me.data.user.email}</Text>
        </Menu.Label>
        <Menu.Item onClick={() => signOut.mutate(undefined, { onSettled: () => navigate('/sign-in') })}>
          Sign out
        </Menu.Item>
      </Menu.Dropdown>
    </Menu>
  );
}

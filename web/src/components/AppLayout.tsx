import { AppShell, Burger, Group, NavLink } from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { Link, Outlet, useLocation, useParams } from 'react-router-dom';
import { useMe } from '../app/session';
import { UserMenu } from '../features/auth/components/UserMenu';
import { LabSwitcher } from '../features/lab/components/LabSwitcher';
import { Logo } from './Logo';

const navigation = [{ to: '/', label: 'Studies' }];

/** The signed-in frame: header with the lab switcher, navigation on the left, the page in the middle. */
export function AppLayout() {
  const [opened, { toggle }] = useDisclosure();
  const { pathname } = useLocation();
  const labNavigation = useLabNavigation();
  return (
    <AppShell
      header={{ height: 56 }}
      navbar={{ width: 220, breakpoint: 'sm', collapsed: { mobile: !opened } }}
      padding="md"
    >
      <AppShell.Header>
        <Group h="100%" px="md" justify="space-between">
          <Group>
            <Burger opened={opened} onClick={toggle} hiddenFrom="sm" size="sm" aria-label="Toggle navigation" />
            <Logo />
          </Group>
          <Group>
            <LabSwitcher />
            <UserMenu />
          </Group>
        </Group>
      </AppShell.Header>
      <AppShell.Navbar p="xs" aria-label="Main navigation">
        {[...navigation, ...labNavigation].map((item) => (
          <NavLink key={item.to} component={Link} to={item.to} label={item.label} active={pathname === item.to} />
        ))}
      </AppShell.Navbar>
      <AppShell.Main>
        <Outlet />
      </AppShell.Main>
    </AppShell>
  );
}

/** The lab's own pages, for the lab in the address (or the person's first lab); some only for its PI. */
function useLabNavigation(): { to: string; label: string }[] {
  const me = useMe();
  const { labId } = useParams();
  const memberships = me.data?.memberships ?? [];
  const membership = memberships.find((m) => m.labId === labId) ?? memberships[0];
  if (!membership) return [];
  const base = `/labs/${membership.labId}`;
  const items = [
    { to: `${base}/datasets`, label: 'Datasets' },
    { to: `${base}/groups`, label: 'Reference groups' },
    { to: `${base}/members`, label: 'Members' },
  ];
  if (membership.role === 'pi') {
    items.push({ to: `${base}/audit`, label: 'Audit log' }, { to: `${base}/outbox`, label: 'Outbox' });
  }
  return items;
}

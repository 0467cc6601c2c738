import { Alert, Button, Center, Loader, Stack } from '@mantine/core';
import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { errorMessage, isUnauthorized } from '../../../app/api-client';
import { useMe } from '../../../app/session';

/** Shows its children to a signed-in person and sends everyone else to sign-in, returning here after. */
export function RequireSession({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) {
    return (
      <Center mih="50vh">
        <Loader aria-label="Checking your session" />
      </Center>
    );
  }
  if (me.isError && isUnauthorized(me.error)) {
    const next = encodeURIComponent(`${location.pathname}${location.search}`);
    return <Navigate to={`/sign-in?next=${next}`} replace />;
  }
  if (me.isError) {
    return (
      <Center mih="50vh">
        <Stack>
          <Alert color="red">Provenote could not be reached: {errorMessage(me.error)}</Alert>
          <Button onClick={() => void me.refetch()}>Try again</Button>
        </Stack>
      </Center>
    );
  }
  return children;
}

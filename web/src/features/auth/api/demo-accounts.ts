import { queryOptions, useQuery } from '@tanstack/react-query';
import { demoAccountsSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** Listed by the API only in a local installation with the demo lab; empty elsewhere. */
export const demoAccountsQuery = () =>
  queryOptions({
    queryKey: ['auth', 'demo-accounts'],
    queryFn: ({ signal }) => apiRequest('/auth/demo-accounts', demoAccountsSchema, { signal }),
    staleTime: Infinity,
  });

export const useDemoAccounts = () => useQuery(demoAccountsQuery());

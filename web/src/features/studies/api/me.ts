import { queryOptions, useQuery } from '@tanstack/react-query';
import { meSchema } from '@provenote/shared/schemas';
import { apiRequest } from './http';

/** The signed-in person and their labs: the study list opens on their first lab. */
export const meQuery = () =>
  queryOptions({ queryKey: ['me'], queryFn: ({ signal }) => apiRequest('/me', meSchema, { signal }) });

export const useMe = () => useQuery(meQuery());

import { queryOptions, useQuery } from '@tanstack/react-query';
import { meSchema } from '@provenote/shared/schemas';
import { apiRequest, isUnauthorized } from './api-client';

/** The signed-in person and their labs; every signed-in screen reads it, so it lives with the app. */
export const meQuery = () =>
  queryOptions({
    queryKey: ['me'],
    queryFn: ({ signal }) => apiRequest('/me', meSchema, { signal }),
    retry: (count, error) => !isUnauthorized(error) && count < 1,
  });

export const useMe = () => useQuery(meQuery());

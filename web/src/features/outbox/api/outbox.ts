import { queryOptions, useQuery } from '@tanstack/react-query';
import { outboxSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const outboxQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'outbox'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/outbox`, outboxSchema, { signal }),
    refetchInterval: 5000,
  });

export const useOutbox = (labId: string) => useQuery(outboxQuery(labId));

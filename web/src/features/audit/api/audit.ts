import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { auditPageSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const auditQuery = (labId: string) =>
  infiniteQueryOptions({
    queryKey: ['labs', labId, 'audit'],
    initialPageParam: null as string | null,
    queryFn: ({ pageParam, signal }) =>
      apiRequest(
        `/labs/${labId}/audit${pageParam ? `?before=${encodeURIComponent(pageParam)}` : ''}`,
        auditPageSchema,
        { signal },
      ),
    getNextPageParam: (page) => page.nextBefore,
  });

export const useAuditLog = (labId: string) => useInfiniteQuery(auditQuery(labId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { projectionSchema, type ProjectionLevel, type ProjectionMethod } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** One stored projection of an assign run, with the group ellipses at one level. */
export const projectionQuery = (labId: string, runId: string, method: ProjectionMethod, level: ProjectionLevel) =>
  queryOptions({
    queryKey: ['labs', labId, 'runs', runId, 'projection', method, level],
    queryFn: ({ signal }) =>
      apiRequest(
        `/labs/${labId}/runs/${runId}/projection?${new URLSearchParams({ method, level: String(level) })}`,
        projectionSchema,
        { signal },
      ),
  });

export const useProjection = (labId: string, runId: string, method: ProjectionMethod, level: ProjectionLevel) =>
  useQuery(projectionQuery(labId, runId, method, level));

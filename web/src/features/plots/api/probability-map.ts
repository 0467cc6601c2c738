import { queryOptions, useQuery } from '@tanstack/react-query';
import { probabilityMapSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** Every unknown's probabilities of a run, thinned by the API to a drawable number of rows. */
export const probabilityMapQuery = (labId: string, runId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'runs', runId, 'probability-map'],
    queryFn: ({ signal }) =>
      apiRequest(`/labs/${labId}/runs/${runId}/probability-map`, probabilityMapSchema, { signal }),
  });

export const useProbabilityMap = (labId: string, runId: string) => useQuery(probabilityMapQuery(labId, runId));

import { queryOptions, useQuery } from '@tanstack/react-query';
import { datasetListSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** The lab's datasets with their versions, for the Data card's pickers. */
export const datasetListQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/datasets`, datasetListSchema, { signal }),
  });

export const useDatasetList = (labId: string) => useQuery(datasetListQuery(labId));

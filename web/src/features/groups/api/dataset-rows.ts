import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { rowsPageSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const ROWS_PAGE_SIZE = 100;

/** One page of a dataset version's samples, to choose group members from. */
export const datasetRowsQuery = (labId: string, datasetId: string, number: number, page: number) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets', datasetId, 'versions', number, 'rows', page],
    queryFn: ({ signal }) =>
      apiRequest(
        `/labs/${labId}/datasets/${datasetId}/versions/${number}/rows?page=${page}&pageSize=${ROWS_PAGE_SIZE}`,
        rowsPageSchema,
        { signal },
      ),
  });

export const useDatasetRows = (labId: string, datasetId: string, number: number, page: number) =>
  useQuery({ ...datasetRowsQuery(labId, datasetId, number, page), placeholderData: keepPreviousData });

import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { checkResultsSchema, type CheckResultsQuery } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export type CheckFilter = Partial<CheckResultsQuery> & { page: number };

/** The Group check card's results for the study's current check run. */
export const checkResultsQuery = (labId: string, studyId: string, runId: string, filter: CheckFilter) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'check-results', runId, filter],
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ page: String(filter.page) });
      if (filter.pageSize) params.set('pageSize', String(filter.pageSize));
      if (filter.outcome) params.set('outcome', filter.outcome);
      if (filter.group) params.set('group', filter.group);
      if (filter.flaggedByRobustFit) params.set('flaggedByRobustFit', 'true');
      return apiRequest(`/labs/${labId}/studies/${studyId}/check-results?${params}`, checkResultsSchema, { signal });
    },
  });

export const useCheckResults = (labId: string, studyId: string, runId: string, filter: CheckFilter) =>
  useQuery({ ...checkResultsQuery(labId, studyId, runId, filter), placeholderData: keepPreviousData });

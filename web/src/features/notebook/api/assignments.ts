import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { assignmentsPageSchema, type AssignmentsQuery } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export type AssignmentsFilter = Partial<AssignmentsQuery> & { page: number };

const queryString = (filter: AssignmentsFilter) =>
  new URLSearchParams(
    Object.entries(filter)
      .filter(([, value]) => value !== undefined && value !== '')
      .map(([key, value]) => [key, String(value)]),
  ).toString();

/** One server page of an assign run's results; sorting, filtering and search happen in PostgreSQL. */
export const assignmentsQuery = (labId: string, runId: string, filter: AssignmentsFilter) =>
  queryOptions({
    queryKey: ['labs', labId, 'runs', runId, 'assignments', filter],
    queryFn: ({ signal }) =>
      apiRequest(`/labs/${labId}/runs/${runId}/assignments?${queryString(filter)}`, assignmentsPageSchema, { signal }),
  });

export const useAssignments = (labId: string, runId: string, filter: AssignmentsFilter) =>
  useQuery({ ...assignmentsQuery(labId, runId, filter), placeholderData: keepPreviousData });

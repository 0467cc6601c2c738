import { queryOptions, useQuery } from '@tanstack/react-query';
import { elementSummarySchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** Per element of the study's reference data: samples with a value, share detected, median and quartiles. */
export const elementSummaryQuery = (labId: string, studyId: string, referenceVersionId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'element-summary', referenceVersionId],
    queryFn: ({ signal }) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/element-summary`, elementSummarySchema, { signal }),
  });

export const useElementSummary = (labId: string, studyId: string, referenceVersionId: string | undefined) =>
  useQuery({ ...elementSummaryQuery(labId, studyId, referenceVersionId ?? ''), enabled: Boolean(referenceVersionId) });

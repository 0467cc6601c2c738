import { queryOptions, useQuery } from '@tanstack/react-query';
import { scatterSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** Measured values of two elements for the study's groups and unknowns. */
export const scatterQuery = (labId: string, studyId: string, x: string, y: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'scatter', x, y],
    queryFn: ({ signal }) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/scatter?${new URLSearchParams({ x, y })}`, scatterSchema, {
        signal,
      }),
  });

export const useScatter = (labId: string, studyId: string, x: string | null, y: string | null) =>
  useQuery({ ...scatterQuery(labId, studyId, x ?? '', y ?? ''), enabled: Boolean(x && y && x !== y) });

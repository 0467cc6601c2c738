import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { scatterSchema, type ScatterQuery } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

type Space = ScatterQuery['space'];

/** Two coordinates (prepared or measured) for the study's groups and unknowns; x and y default on the API. */
export const scatterQuery = (labId: string, studyId: string, space: Space, x: string | null, y: string | null) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'scatter', space, x, y],
    queryFn: ({ signal }) => {
      const params = new URLSearchParams({ space });
      if (x) params.set('x', x);
      if (y) params.set('y', y);
      return apiRequest(`/labs/${labId}/studies/${studyId}/scatter?${params}`, scatterSchema, { signal });
    },
  });

export const useScatter = (labId: string, studyId: string, space: Space, x: string | null, y: string | null) =>
  useQuery({
    ...scatterQuery(labId, studyId, space, x, y),
    enabled: x === null || x !== y,
    // The axis choices come from the last answer, so they stay while the next pair loads.
    placeholderData: keepPreviousData,
  });

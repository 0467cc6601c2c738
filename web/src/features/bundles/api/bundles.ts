import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  bundleListSchema,
  bundleSummarySchema,
  openedBundleSchema,
  type BundleSummary,
} from '@provenote/shared/schemas';
import { ApiError, apiRequest } from '../../../app/api-client';

/** How often the list is re-read while a bundle is being built, besides the run's own progress. */
const BUILDING_POLL_MS = 2000;

export const bundlesQuery = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'bundles'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies/${studyId}/bundles`, bundleListSchema, { signal }),
  });

const building = (bundle: BundleSummary) => bundle.status === 'queued' || bundle.status === 'running';

export const useBundles = (labId: string, studyId: string) =>
  useQuery({
    ...bundlesQuery(labId, studyId),
    refetchInterval: (query) => (query.state.data?.bundles.some(building) ? BUILDING_POLL_MS : false),
  });

export function useBuildBundle(labId: string, studyId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`/labs/${labId}/studies/${studyId}/bundles`, bundleSummarySchema, { method: 'POST' }),
    onSuccess: () => client.invalidateQueries({ queryKey: bundlesQuery(labId, studyId).queryKey }),
  });
}

export const bundleDownloadUrl = (labId: string, bundleId: string) => `/api/labs/${labId}/bundles/${bundleId}/download`;

function csrfFromCookie(): string {
  const part = document.cookie.split('; ').find((cookie) => cookie.startsWith('provenote_csrf='));
  return part ? decodeURIComponent(part.slice('provenote_csrf='.length)) : '';
}

/**
 * multipart upload: apiRequest speaks JSON only. A bundle that does not verify answers 422; its errors
 * (one per problem, each naming the file) travel in the ApiError.
 */
export async function openBundle(labId: string, file: File) {
  const body = new FormData();
  body.append('file', file);
  const res = await fetch(`/api/labs/${labId}/bundles/open`, {
    method: 'POST',
    body,
    credentials: 'same-origin',
    headers: { Accept: 'application/json', 'X-CSRF-Token': csrfFromCookie() },
  });
  const json = (await res.json().catch(() => ({}))) as {
    message?: string;
    errors?: { path: string; message: string }[];
  };
  if (!res.ok) throw new ApiError(res.status, json.message ?? `The server answered ${res.status}`, json.errors ?? []);
  return openedBundleSchema.parse(json);
}

export const useOpenBundle = (labId: string) => useMutation({ mutationFn: (file: File) => openBundle(labId, file) });

import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  type CreateDataset,
  type CreateVersion,
  type DatasetMapping,
  datasetListSchema,
  datasetSchema,
  fileLayoutSchema,
  importPreviewSchema,
  problemsPageSchema,
  rowsPageSchema,
} from '@provenote/shared/schemas';
import { ApiError, apiRequest } from '../../../app/api-client';

export const datasetsQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/datasets`, datasetListSchema, { signal }),
  });
export const useDatasets = (labId: string) => useQuery(datasetsQuery(labId));

export const datasetQuery = (labId: string, datasetId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets', datasetId],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/datasets/${datasetId}`, datasetSchema, { signal }),
  });
export const useDataset = (labId: string, datasetId: string) => useQuery(datasetQuery(labId, datasetId));

export const versionRowsQuery = (labId: string, datasetId: string, version: number, page: number) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets', datasetId, 'versions', version, 'rows', page],
    queryFn: ({ signal }) =>
      apiRequest(
        `/labs/${labId}/datasets/${datasetId}/versions/${version}/rows?page=${page}&pageSize=50`,
        rowsPageSchema,
        { signal },
      ),
  });
export const useVersionRows = (labId: string, datasetId: string, version: number, page: number) =>
  useQuery(versionRowsQuery(labId, datasetId, version, page));

export const versionProblemsQuery = (labId: string, datasetId: string, version: number, page: number) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets', datasetId, 'versions', version, 'problems', page],
    queryFn: ({ signal }) =>
      apiRequest(
        `/labs/${labId}/datasets/${datasetId}/versions/${version}/problems?page=${page}&pageSize=100`,
        problemsPageSchema,
        { signal },
      ),
  });
export const useVersionProblems = (labId: string, datasetId: string, version: number, page: number) =>
  useQuery(versionProblemsQuery(labId, datasetId, version, page));

function csrfFromCookie(): string {
  const part = document.cookie.split('; ').find((cookie) => cookie.startsWith('provenote_csrf='));
  return part ? decodeURIComponent(part.slice('provenote_csrf='.length)) : '';
}

/** multipart upload: apiRequest speaks JSON only, so this one request is built by hand. */
export async function uploadFile(labId: string, file: File) {
  const body = new FormData();
  body.append('file', file);
  const res = await fetch(`/api/labs/${labId}/dataset-files`, {
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
  return fileLayoutSchema.parse(json);
}
export const useUploadFile = (labId: string) => useMutation({ mutationFn: (file: File) => uploadFile(labId, file) });

export const usePreview = (labId: string) =>
  useMutation({
    mutationFn: ({ fileId, mapping }: { fileId: string; mapping: DatasetMapping }) =>
      apiRequest(`/labs/${labId}/dataset-files/${fileId}/preview`, importPreviewSchema, {
        method: 'POST',
        body: { mapping },
      }),
  });

export function useCreateDataset(labId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateDataset) =>
      apiRequest(`/labs/${labId}/datasets`, datasetSchema, { method: 'POST', body: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: datasetsQuery(labId).queryKey }),
  });
}

export function useAddVersion(labId: string, datasetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateVersion) =>
      apiRequest(`/labs/${labId}/datasets/${datasetId}/versions`, datasetSchema, { method: 'POST', body: input }),
    onSuccess: () => client.invalidateQueries({ queryKey: datasetsQuery(labId).queryKey }),
  });
}

export function useDeleteDataset(labId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ datasetId, version }: { datasetId: string; version?: number }) =>
      apiRequest(`/labs/${labId}/datasets/${datasetId}${version === undefined ? '' : `/versions/${version}`}`, null, {
        method: 'DELETE',
      }),
    onSuccess: () => client.invalidateQueries({ queryKey: datasetsQuery(labId).queryKey }),
  });
}

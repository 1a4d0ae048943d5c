import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ApiError, apiClient, getCsrfToken } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';
import type { ColumnMapping, ImportPreview, SalesImport, UploadResult } from './types';

export const importsQueryOptions = (siteId: string | undefined) =>
  queryOptions({
    queryKey: [...booksKey, 'imports', siteId] as const,
    queryFn: () => apiClient.get<{ imports: SalesImport[] }>(paths.api.salesImports(siteId)),
    enabled: Boolean(siteId),
  });

export function useImports(siteId: string | undefined) {
  return useQuery(importsQueryOptions(siteId));
}

/**
 * Uploads the till's file through XMLHttpRequest, whose upload events give the progress bar
 * (fetch has none); the answer and errors read like the rest of the API client's.
 */
export function uploadTillFile(siteId: string, file: File, onProgress: (fraction: number) => void): Promise<UploadResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', paths.api.salesImports());
    xhr.setRequestHeader('Accept', 'application/json');
    const csrf = getCsrfToken();
    if (csrf) xhr.setRequestHeader('X-CSRF-Token', csrf);
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(new ApiError(0, 'network', 'Could not reach the server. Check your connection and try again.'));
    xhr.onload = () => {
      let body: { error?: { code?: string; message?: string; fields?: Record<string, string> } } & Partial<UploadResult> = {};
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // not JSON: reported below by status
      }
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as UploadResult);
      else reject(new ApiError(xhr.status, body.error?.code ?? `http_${xhr.status}`, body.error?.message ?? `The server answered ${xhr.status}.`, body.error?.fields ?? {}));
    };
    const form = new FormData();
    form.append('siteId', siteId);
    form.append('file', file);
    xhr.send(form);
  });
}

export function usePreviewImport() {
  return useMutation({ mutationFn: ({ id, columns }: { id: string; columns: ColumnMapping }) => apiClient.post<ImportPreview>(paths.api.importPreview(id), { columns }) });
}

export function useAcceptImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, columns, items }: { id: string; columns: ColumnMapping; items: { tillItem: string; tillSize: string; drinkSizeId: string }[] }) =>
      apiClient.post<{ import: SalesImport }>(paths.api.importAccept(id), { columns, items }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}

export function useDiscardImport() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiClient.delete(paths.api.salesImport(id)),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: booksKey }),
  });
}

import { ApiError, getCsrfToken } from '../../../lib/api-client';
import { hrefOf, useContractMutation, useContractQuery } from '../../../lib/contract';
import { acceptImport, discardImport, listImports, previewImport, uploadImport, type UploadResult } from '../../../shared/contract/books';
import { BOOKS_PATHS } from './books-data';

export function useImports(siteId: string | undefined) {
  return useContractQuery(listImports, { query: { siteId } }, { enabled: Boolean(siteId) });
}

/**
 * Uploads the till's file through XMLHttpRequest, whose upload events give the progress bar
 * (fetch has none); the answer and errors read like the rest of the API client's.
 */
export function uploadTillFile(siteId: string, file: File, onProgress: (fraction: number) => void): Promise<UploadResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', hrefOf(uploadImport, {}));
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
  return useContractMutation(previewImport);
}

export function useAcceptImport() {
  return useContractMutation(acceptImport, { invalidates: BOOKS_PATHS });
}

export function useDiscardImport() {
  return useContractMutation(discardImport, { invalidates: BOOKS_PATHS });
}

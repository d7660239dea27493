// The files of a draft: POST /api/packages/:id/files (multipart, one PDF, through
// XMLHttpRequest so the bytes sent can be shown), DELETE …/files/:fileId, and the link
// that opens a stored PDF.
import { FileSummary, type FileKind } from '@shared/schemas/packages';
import { api, apiErrorFrom, ApiError, CSRF_HEADER } from '@/lib/api-client';

export function fileUrl(packageId: string, fileId: string): string {
  return `/api/packages/${encodeURIComponent(packageId)}/files/${encodeURIComponent(fileId)}`;
}

export type UploadProgress = { loaded: number; total: number };

export function uploadFile(
  packageId: string,
  kind: FileKind,
  file: File,
  onProgress: (progress: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<FileSummary> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/packages/${encodeURIComponent(packageId)}/files`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    for (const [name, value] of Object.entries(CSRF_HEADER)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      onProgress({ loaded: event.loaded, total: event.lengthComputable ? event.total : file.size });
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = FileSummary.safeParse(safeJson(xhr.responseText));
        if (parsed.success) resolve(parsed.data);
        else
          reject(
            new ApiError(
              xhr.status,
              'unexpected_response',
              'The server stored the file but its answer was not understood. Reload the page to see the file list.',
            ),
          );
      } else {
        reject(apiErrorFrom(xhr.status, xhr.responseText));
      }
    };
    xhr.onerror = () => reject(apiErrorFrom(0, ''));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort());
    const form = new FormData();
    form.append('kind', kind);
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

export function deleteFile(packageId: string, fileId: string): Promise<void> {
  return api.delete(fileUrl(packageId, fileId));
}

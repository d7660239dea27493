// The import preview: POST /api/library/chart-import/text (pasted cells) or …/file (CSV or
// .xlsx, multipart). The server stores nothing; the accepted grid goes into a new version.
import { useMutation } from '@tanstack/react-query';
import { ChartPreviewResponse } from '@shared/schemas/library';
import { api, apiErrorFrom, ApiError, CSRF_HEADER } from '@/lib/api-client';
import type { z } from 'zod';

export type ChartPreview = z.infer<typeof ChartPreviewResponse>;

export function previewChartFile(file: File): Promise<ChartPreview> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/library/chart-import/file');
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    for (const [name, value] of Object.entries(CSRF_HEADER)) xhr.setRequestHeader(name, value);
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = ChartPreviewResponse.safeParse(JSON.parse(xhr.responseText));
        if (parsed.success) resolve(parsed.data);
        else
          reject(
            new ApiError(xhr.status, 'unexpected_response', 'The preview could not be read. Try again.'),
          );
      } else reject(apiErrorFrom(xhr.status, xhr.responseText));
    };
    xhr.onerror = () => reject(apiErrorFrom(0, ''));
    const form = new FormData();
    form.append('file', file, file.name);
    xhr.send(form);
  });
}

export function useChartPreview() {
  return useMutation({
    mutationFn: (source: { text: string } | { file: File }) =>
      'file' in source
        ? previewChartFile(source.file)
        : api.post('/api/library/chart-import/text', { text: source.text }, ChartPreviewResponse),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiErrorSchema } from '@shared/schemas/common';
import { benchUploadField, type BenchOriginal } from '@shared/schemas/bench';
import { ApiError } from '@/lib/api-client';
import { invalidateBench } from './invalidate';
import { benchSheetUrl } from './paths';

export type UploadBenchOriginalVariables = {
  buildId: string;
  sheetId: string;
  file: File;
  /** 0–1 as the bytes go out. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
};

function errorFrom(xhr: XMLHttpRequest): ApiError {
  let body: unknown = null;
  try {
    body = JSON.parse(xhr.responseText);
  } catch {
    // Not our JSON (a proxy's page): a generic message below.
  }
  const parsed = apiErrorSchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError(xhr.status, code, message, fields);
  }
  if (xhr.status === 413) return new ApiError(413, 'too_large', 'The file is too large.');
  return new ApiError(
    xhr.status,
    `http_${xhr.status}`,
    xhr.status >= 500
      ? 'Something went wrong on our side. Try again in a moment.'
      : `Upload failed (${xhr.status}).`,
  );
}

/**
 * Sends the shop's original sheet (a PDF or a photo), replacing any earlier one.
 * XMLHttpRequest rather than fetch: only it reports upload progress.
 */
export function uploadBenchOriginal({
  buildId,
  sheetId,
  file,
  onProgress,
  signal,
}: UploadBenchOriginalVariables): Promise<BenchOriginal> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('PUT', `${benchSheetUrl(buildId, sheetId)}/original`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve((JSON.parse(xhr.responseText) as { original: BenchOriginal }).original);
        } catch {
          reject(new ApiError(xhr.status, 'bad_response', 'The server answered oddly. Reload.'));
        }
      } else reject(errorFrom(xhr));
    };
    xhr.onerror = () =>
      reject(
        new ApiError(0, 'network', 'Could not reach Headroom. Check your connection and retry.'),
      );
    xhr.onabort = () => reject(new DOMException('Upload canceled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const body = new FormData();
    body.append(benchUploadField, file, file.name);
    xhr.send(body);
  });
}

export const useUploadBenchOriginal = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadBenchOriginal,
    onSuccess: (_original, { buildId }) => invalidateBench(queryClient, buildId),
  });
};

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiErrorSchema } from '@shared/schemas/common';
import { photoUploadField, type Photo } from '@shared/schemas/photos';
import { ApiError } from '@/lib/api-client';
import { invalidatePhotos } from './invalidate';

export type PhotoTarget = { stepId: string } | { partId: string };

export type UploadPhotoVariables = {
  buildId: string;
  target: PhotoTarget;
  file: File;
  caption?: string;
  /** 0–1 as the bytes go out. */
  onProgress?: (fraction: number) => void;
  signal?: AbortSignal;
};

function targetPath(buildId: string, target: PhotoTarget): string {
  const build = `/api/builds/${encodeURIComponent(buildId)}`;
  return 'stepId' in target
    ? `${build}/steps/${encodeURIComponent(target.stepId)}/photos`
    : `${build}/parts/${encodeURIComponent(target.partId)}/photos`;
}

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
  if (xhr.status === 413) return new ApiError(413, 'too_large', 'The photo is too large.');
  if (xhr.status === 403)
    return new ApiError(403, 'forbidden', 'Your role on this build does not allow that.');
  return new ApiError(
    xhr.status,
    `http_${xhr.status}`,
    xhr.status >= 500
      ? 'Something went wrong on our side. Try again in a moment.'
      : `Upload failed (${xhr.status}).`,
  );
}

/**
 * Sends one photo in its own request. XMLHttpRequest rather than fetch: only it reports
 * upload progress, which each file's progress bar needs.
 */
export function uploadPhoto({
  buildId,
  target,
  file,
  caption,
  onProgress,
  signal,
}: UploadPhotoVariables): Promise<Photo> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', targetPath(buildId, target));
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress?.(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          const data = JSON.parse(xhr.responseText) as { photos: Photo[] };
          resolve(data.photos[0]);
        } catch {
          reject(new ApiError(xhr.status, 'bad_response', 'The server answered oddly. Reload.'));
        }
      } else {
        reject(errorFrom(xhr));
      }
    };
    xhr.onerror = () =>
      reject(
        new ApiError(0, 'network', 'Could not reach Headroom. Check your connection and retry.'),
      );
    xhr.onabort = () => reject(new DOMException('Upload canceled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });

    const body = new FormData();
    if (caption) body.append('caption', caption);
    body.append(photoUploadField, file, file.name);
    xhr.send(body);
  });
}

export const useUploadPhoto = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: uploadPhoto,
    onSuccess: (_photo, { buildId }) => invalidatePhotos(queryClient, buildId),
  });
};

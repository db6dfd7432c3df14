/**
 * A photo taken without signal: resized on the device to the web size the server keeps
 * (so a queue of photos does not fill the phone), then kept with the step's waiting entries.
 */
import { photoSizes } from '@shared/schemas/photos';
import { enqueue } from '@/lib/offline-queue';
import type { PhotoTarget } from '../api/upload-photo';

/** A JPEG no larger than the web size on its long side; the original when it cannot be decoded here. */
export async function resizeForWeb(file: File): Promise<Blob> {
  try {
    const bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
    const scale = Math.min(1, photoSizes.web / Math.max(bitmap.width, bitmap.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.round(bitmap.width * scale));
    canvas.height = Math.max(1, Math.round(bitmap.height * scale));
    canvas.getContext('2d')!.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
    bitmap.close();
    const blob = await new Promise<Blob | null>((resolve) =>
      canvas.toBlob(resolve, 'image/jpeg', 0.85),
    );
    return blob && blob.size < file.size ? blob : file;
  } catch {
    // HEIC and the like: the browser cannot draw it; the server converts it when it arrives.
    return file;
  }
}

/** Keeps one step photo on the device until the network returns. */
export async function keepPhotoOffline(
  buildId: string,
  target: PhotoTarget,
  file: File,
  caption: string,
) {
  if (!('stepId' in target)) throw new Error('Only step photos are kept offline');
  const blob = await resizeForWeb(file);
  const name = blob === file ? file.name : file.name.replace(/\.[^.]*$/, '') + '.jpg';
  await enqueue({
    buildId,
    stepId: target.stepId,
    kind: 'photo',
    method: 'POST',
    path: `/api/builds/${encodeURIComponent(buildId)}/steps/${encodeURIComponent(target.stepId)}/photos`,
    photo: { blob, name, caption },
    label: `Photo ${name}${caption ? ` (“${caption}”)` : ''}`,
  });
}

/**
 * Photo log: photos of a step or of a part. The server checks the content (not
 * the name), turns each photo upright, strips every piece of metadata (EXIF, GPS,
 * XMP, IPTC, ICC) and keeps only a web-sized copy and a thumbnail, both JPEG.
 * Originals are not kept: they carry the metadata.
 */
import { z } from 'zod';
import type { Person } from './install-log';
import { trimmed } from './common';

/** Largest photo accepted by default: 25 MiB (PHOTO_MAX_MB changes it). */
export const defaultPhotoMaxBytes = 25 * 1024 * 1024;
/** Photos in one upload request. */
export const maxPhotosPerUpload = 10;
/** The multipart field the files travel in. */
export const photoUploadField = 'photos';

/** Formats accepted, as sharp names them; HEIC/AVIF ('heif') only where the server's sharp decodes it. */
export const photoFormats = ['jpeg', 'png', 'webp', 'heif'] as const;
export type PhotoFormat = (typeof photoFormats)[number];
/** For the file picker's accept attribute. */
export const photoAccept = 'image/jpeg,image/png,image/webp,image/heic,image/heif,.heic,.heif';

/** Longest side of each stored size, in pixels. */
export const photoSizes = { web: 1600, thumb: 320 } as const;
export type PhotoSize = keyof typeof photoSizes;

export const captionSchema = trimmed(500, 'Caption');

/** The text fields sent with an upload (multipart), applied to every photo in it. */
export const uploadPhotoFieldsSchema = z.object({ caption: captionSchema.optional() }).strict();
export type UploadPhotoFields = z.infer<typeof uploadPhotoFieldsSchema>;

export const updatePhotoInputSchema = z.object({ caption: captionSchema }).strict();
export type UpdatePhotoInput = z.infer<typeof updatePhotoInputSchema>;

export type PhotoImage = { url: string; width: number; height: number; contentType: string };

/** A photo as the API returns it. */
export type Photo = {
  id: string;
  buildId: string;
  stepId: string | null;
  partId: string | null;
  caption: string;
  /** What was uploaded: its format and upright size. */
  original: { format: PhotoFormat; width: number; height: number; bytes: number };
  web: PhotoImage;
  thumb: PhotoImage;
  uploadedBy: Person | null;
  createdAt: string;
  updatedAt: string;
};

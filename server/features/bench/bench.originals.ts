/**
 * The shop's original sheet: a PDF or a photo, told apart by content, never by
 * name or declared type. A PDF must start with the magic bytes `%PDF-` and is
 * kept as sent. A photo must decode completely (sharp, through the photo log's
 * checks); it is kept at full size so the numbers stay legible, re-encoded
 * after `.rotate()` — sharp writes no EXIF, XMP, IPTC or ICC unless asked, so
 * GPS and camera data are gone — plus the usual web copy and thumbnail.
 */
import fs from 'node:fs/promises';
import sharp from 'sharp';
import type { BenchOriginalFormat } from '@shared/schemas/bench';
import { AppError } from '@server/lib/errors';
import { processPhoto, type ProcessedPhoto } from '@server/features/photos';

export type UploadedFile = { path: string; originalname: string; size: number };

type Image = { data: Buffer; width: number; height: number };

export type ProcessedOriginal = {
  format: BenchOriginalFormat;
  /** The stored original's type and extension. */
  contentType: 'application/pdf' | 'image/jpeg' | 'image/png' | 'image/webp';
  extension: 'pdf' | 'jpg' | 'png' | 'webp';
  width: number | null;
  height: number | null;
  original: Buffer;
  web: Image | null;
  thumb: Image | null;
};

const PDF_MAGIC = Buffer.from('%PDF-', 'latin1');

async function head(file: string, length: number): Promise<Buffer> {
  const handle = await fs.open(file, 'r');
  try {
    const buffer = Buffer.alloc(length);
    const { bytesRead } = await handle.read(buffer, 0, length, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

const sendWhat = 'Send a PDF, or a photo of the sheet (JPEG, PNG, WebP or HEIC)';

/** The full-size original without metadata, in the format it came in (HEIC becomes JPEG). */
async function reencode(file: string, format: ProcessedPhoto['format']) {
  const upright = sharp(file, { failOn: 'truncated' }).rotate();
  if (format === 'png') {
    return { data: await upright.png({ compressionLevel: 9 }).toBuffer(), type: 'png' as const };
  }
  if (format === 'webp') {
    return { data: await upright.webp({ quality: 92 }).toBuffer(), type: 'webp' as const };
  }
  // JPEG, and HEIC (which this server may decode but not write): a high-quality JPEG.
  return {
    data: await upright.jpeg({ quality: 92, mozjpeg: true }).toBuffer(),
    type: 'jpeg' as const,
  };
}

/** Checks and prepares one upload; throws a 400 naming the file when it is neither a PDF nor a photo. */
export async function processOriginal(file: UploadedFile): Promise<ProcessedOriginal> {
  const label = JSON.stringify(file.originalname || 'the file');
  const start = await head(file.path, PDF_MAGIC.length);
  if (start.equals(PDF_MAGIC)) {
    const data = await fs.readFile(file.path);
    return {
      format: 'pdf',
      contentType: 'application/pdf',
      extension: 'pdf',
      width: null,
      height: null,
      original: data,
      web: null,
      thumb: null,
    };
  }
  if (/\.pdf$/i.test(file.originalname)) {
    throw new AppError(
      400,
      'not_a_pdf',
      `${label} is named like a PDF but is not one (a PDF starts with "%PDF-"). ${sendWhat}.`,
      { file: 'This file is not a PDF' },
    );
  }
  let photo: ProcessedPhoto;
  try {
    photo = await processPhoto(file.path, file.originalname, file.size);
  } catch (err) {
    if (err instanceof AppError && err.status === 400) {
      const message =
        err.code === 'not_an_image'
          ? `${label} is neither a PDF nor a photo Headroom can read. ${sendWhat}.`
          : err.message;
      throw new AppError(400, err.code, message, { file: message });
    }
    throw err;
  }
  let encoded: Awaited<ReturnType<typeof reencode>>;
  try {
    encoded = await reencode(file.path, photo.format);
  } catch {
    const message = `${label} could not be decoded at full size; it may be damaged.`;
    throw new AppError(400, 'undecodable_image', message, { file: message });
  }
  const byType = {
    jpeg: { contentType: 'image/jpeg', extension: 'jpg' },
    png: { contentType: 'image/png', extension: 'png' },
    webp: { contentType: 'image/webp', extension: 'webp' },
  } as const;
  return {
    format: photo.format,
    ...byType[encoded.type],
    width: photo.width,
    height: photo.height,
    original: encoded.data,
    web: photo.web,
    thumb: photo.thumb,
  };
}

/**
 * The name to keep and offer for download: no folders, no control characters,
 * at most 120 characters, and the extension the content has.
 */
export function cleanFileName(raw: string, extension: string): string {
  const base = (raw.split(/[\\/]/).pop() ?? '')
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001f\u007f"]/g, '')
    .replace(/\.[A-Za-z0-9]{1,5}$/, '')
    .trim()
    .slice(0, 120);
  return `${base || 'bench-sheet'}.${extension}`;
}

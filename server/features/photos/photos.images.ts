/**
 * Turns an uploaded file into the two stored sizes. The content decides, never
 * the name or the declared type: sharp must recognise the file as JPEG, PNG,
 * WebP or HEIF/HEIC and decode it completely.
 *
 * Metadata: sharp writes no EXIF, XMP, IPTC or ICC to its output unless asked
 * (withMetadata/keepExif…, never called here), so after .rotate() has applied
 * the EXIF orientation to the pixels, GPS and camera data are gone.
 */
import os from 'node:os';
import sharp, { type Metadata } from 'sharp';
import { photoFormats, photoSizes, type PhotoFormat } from '@shared/schemas/photos';
import { AppError } from '@server/lib/errors';

export type ProcessedImage = { data: Buffer; width: number; height: number };
export type ProcessedPhoto = {
  format: PhotoFormat;
  /** Upright size of the upload (orientation applied). */
  width: number;
  height: number;
  bytes: number;
  contentType: 'image/jpeg';
  web: ProcessedImage;
  thumb: ProcessedImage;
};

/** HEIC/AVIF only where this sharp build can read HEIF files. */
export function acceptedFormats(): PhotoFormat[] {
  return photoFormats.filter((f) => f !== 'heif' || Boolean(sharp.format.heif?.input?.file));
}

const names: Record<PhotoFormat, string> = { jpeg: 'JPEG', png: 'PNG', webp: 'WebP', heif: 'HEIC' };
const acceptedList = () =>
  acceptedFormats()
    .map((f) => names[f])
    .join(', ');

function refuse(code: string, message: string): never {
  throw new AppError(400, code, message);
}

// Chosen on purpose (npm run bench:photos): no operation cache, since an upload is
// never read twice; libvips threads per image = cores; and at most that many photos
// converted at once, so four simultaneous uploads queue instead of each holding a
// decoded 12-megapixel image in memory.
sharp.cache(false);
const parallel = Math.max(1, os.availableParallelism());
sharp.concurrency(parallel);
let running = 0;
const waiting: (() => void)[] = [];
async function oneAtATurn<T>(work: () => Promise<T>): Promise<T> {
  if (running >= parallel) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  try {
    return await work();
  } finally {
    running--;
    waiting.shift()?.();
  }
}

/**
 * Both stored sizes from one decode: the upload is turned upright, shrunk to the
 * web size (libjpeg shrinks on load) and flattened once, into raw pixels; the web
 * copy and the thumbnail are encoded from those. Plain libjpeg-turbo with
 * optimised Huffman tables: mozjpeg saved a few percent of bytes at 6–8× the time.
 */
async function render(
  input: string | Buffer,
): Promise<{ web: ProcessedImage; thumb: ProcessedImage }> {
  const { data, info } = await sharp(input, { failOn: 'truncated' })
    .rotate()
    .resize({
      width: photoSizes.web,
      height: photoSizes.web,
      fit: 'inside',
      withoutEnlargement: true,
    })
    // JPEG has no transparency: transparent PNG/WebP areas become white, not black.
    .flatten({ background: '#ffffff' })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const raw = { raw: { width: info.width, height: info.height, channels: info.channels } };
  const [web, thumb] = await Promise.all([
    sharp(data, raw)
      .jpeg({ quality: 82, optimiseCoding: true })
      .toBuffer({ resolveWithObject: true }),
    sharp(data, raw)
      .resize({
        width: photoSizes.thumb,
        height: photoSizes.thumb,
        fit: 'inside',
        withoutEnlargement: true,
      })
      .jpeg({ quality: 72, optimiseCoding: true })
      .toBuffer({ resolveWithObject: true }),
  ]);
  return {
    web: { data: web.data, width: web.info.width, height: web.info.height },
    thumb: { data: thumb.data, width: thumb.info.width, height: thumb.info.height },
  };
}

/** Checks and converts one upload; throws a 400 AppError naming the file when it is not a usable photo. */
export async function processPhoto(
  input: string | Buffer,
  fileName: string,
  bytes: number,
): Promise<ProcessedPhoto> {
  const label = JSON.stringify(fileName || 'the file');
  let meta: Metadata;
  try {
    meta = await sharp(input, { failOn: 'truncated' }).metadata();
  } catch {
    refuse('not_an_image', `${label} is not a photo Headroom can read. Send ${acceptedList()}.`);
  }
  const format = meta.format as string;
  if (!(acceptedFormats() as string[]).includes(format)) {
    refuse(
      'unsupported_format',
      `${label} is a ${format.toUpperCase()} file. Send ${acceptedList()}.`,
    );
  }
  try {
    const { web, thumb } = await oneAtATurn(() => render(input));
    return {
      format: format as PhotoFormat,
      width: meta.autoOrient?.width ?? meta.width,
      height: meta.autoOrient?.height ?? meta.height,
      bytes,
      contentType: 'image/jpeg',
      web,
      thumb,
    };
  } catch {
    const hint =
      format === 'heif'
        ? ' This server cannot decode this HEIC photo: set the phone camera to "Most compatible" (JPEG) or export it as JPEG.'
        : '';
    refuse(
      'undecodable_image',
      `${label} could not be decoded; it may be damaged or cut short.${hint}`,
    );
  }
}

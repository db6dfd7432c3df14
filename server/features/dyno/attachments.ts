/**
 * A run's attachment: the dyno's own file (exported as PDF or as text/CSV)
 * or a photo of its printout. The content decides what a file is, never its
 * name or declared type — and when the name or type claims something the
 * content is not, the upload is refused, so a file is always what it says.
 *
 * - PDF: starts with `%PDF-` and ends with an `%%EOF` marker (ISO 32000-1,
 *   7.5.2 and 7.5.5), so a cut-off download is refused.
 * - Photo: decoded completely by sharp as JPEG, PNG or WebP, turned upright
 *   and written again without metadata (GPS and camera data gone), full size.
 * - Text: valid UTF-8 with no control characters but tab, CR and LF.
 */
import sharp from 'sharp';
import type { DynoAttachmentKind } from '@shared/schemas/dyno';
import { AppError } from '@server/lib/errors';

export type CheckedAttachment = {
  kind: DynoAttachmentKind;
  contentType: string;
  extension: string;
  data: Buffer;
};

type Detected =
  { kind: 'pdf' } | { kind: 'image'; format: 'jpeg' | 'png' | 'webp' } | { kind: 'text' };

/** What a name or a type says a file is; an image claim may leave its format open (image/*). */
type Claim = Detected | { kind: 'image'; format: null };

const imageFormats = ['jpeg', 'png', 'webp'] as const;
const imageNames = { jpeg: 'a JPEG photo', png: 'a PNG image', webp: 'a WebP image' } as const;

/** What a name's extension claims. Unknown extensions are refused by name. */
const claims: Record<string, Detected> = {
  pdf: { kind: 'pdf' },
  jpg: { kind: 'image', format: 'jpeg' },
  jpeg: { kind: 'image', format: 'jpeg' },
  png: { kind: 'image', format: 'png' },
  webp: { kind: 'image', format: 'webp' },
  csv: { kind: 'text' },
  txt: { kind: 'text' },
  tsv: { kind: 'text' },
};

/** What a declared Content-Type claims; generic types claim nothing. */
function claimOfType(type: string): Claim | null {
  const t = type.toLowerCase().split(';')[0].trim();
  if (t === 'application/pdf') return { kind: 'pdf' };
  if (t === 'image/jpeg' || t === 'image/jpg') return { kind: 'image', format: 'jpeg' };
  if (t === 'image/png') return { kind: 'image', format: 'png' };
  if (t === 'image/webp') return { kind: 'image', format: 'webp' };
  if (t.startsWith('text/')) return { kind: 'text' };
  if (t.startsWith('image/')) return { kind: 'image', format: null };
  return null;
}

const accepted =
  'Attach a PDF, a photo of the printout (JPEG, PNG or WebP) or a text or CSV file exported from the dyno';

function describe(d: Claim) {
  if (d.kind === 'pdf') return 'a PDF';
  if (d.kind === 'text') return 'a text file';
  return d.format ? imageNames[d.format] : 'an image';
}

function matches(claim: Claim, content: Detected) {
  if (claim.kind !== content.kind) return false;
  return (
    claim.kind !== 'image' ||
    content.kind !== 'image' ||
    !claim.format ||
    claim.format === content.format
  );
}

function refuse(code: string, message: string): never {
  throw new AppError(400, code, message, { file: message });
}

function isPdf(data: Buffer) {
  return data.subarray(0, 5).toString('latin1') === '%PDF-';
}

function isText(data: Buffer) {
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(data);
  } catch {
    return false;
  }
  // Control characters other than tab, LF, CR (and a form feed some printers emit) mean binary.
  // eslint-disable-next-line no-control-regex
  return !/[\u0000-\u0008\u000B\u000E-\u001F\u007F]/.test(text);
}

async function imageFormat(data: Buffer): Promise<'jpeg' | 'png' | 'webp' | 'other' | null> {
  try {
    const meta = await sharp(data, { failOn: 'truncated' }).metadata();
    return (imageFormats as readonly string[]).includes(meta.format)
      ? (meta.format as 'jpeg' | 'png' | 'webp')
      : 'other';
  } catch {
    return null;
  }
}

/** Checks an uploaded attachment by its content against what it claims; a 400 naming the file otherwise. */
export async function checkAttachment(
  data: Buffer,
  fileName: string,
  declaredType: string,
): Promise<CheckedAttachment> {
  const label = JSON.stringify(fileName || 'The file');
  if (data.length === 0) refuse('empty_file', `${label} is empty; nothing was saved`);
  const ext = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase() ?? '';
  if (ext && !Object.hasOwn(claims, ext)) {
    refuse('unsupported_attachment', `${label} is a .${ext} file. ${accepted}.`);
  }

  let detected: Detected;
  if (isPdf(data)) {
    detected = { kind: 'pdf' };
  } else {
    const format = await imageFormat(data);
    if (format === 'other') {
      refuse(
        'unsupported_attachment',
        `${label} is a kind of image Headroom does not keep. ${accepted}.`,
      );
    }
    if (format) detected = { kind: 'image', format };
    else if (isText(data)) detected = { kind: 'text' };
    else
      refuse('unsupported_attachment', `${label} is not a file Headroom can check. ${accepted}.`);
  }

  for (const claim of [ext ? claims[ext] : null, claimOfType(declaredType)]) {
    if (claim && !matches(claim, detected)) {
      refuse(
        'attachment_mismatch',
        `${label} claims to be ${describe(claim)} but its content is ${describe(detected)}; nothing was saved`,
      );
    }
  }

  if (detected.kind === 'pdf') {
    if (!data.subarray(Math.max(0, data.length - 2048)).includes('%%EOF')) {
      refuse(
        'damaged_file',
        `${label} is a PDF that ends too early (no end marker); it may be cut short`,
      );
    }
    return { kind: 'pdf', contentType: 'application/pdf', extension: 'pdf', data };
  }
  if (detected.kind === 'text') {
    const csv = ext === 'csv' || declaredType.toLowerCase().startsWith('text/csv');
    return {
      kind: 'text',
      contentType: csv ? 'text/csv; charset=utf-8' : 'text/plain; charset=utf-8',
      extension: csv ? 'csv' : 'txt',
      data,
    };
  }
  const format = detected.format;
  try {
    // Decoded completely and written again: a damaged file fails here, and no metadata survives.
    const image = sharp(data, { failOn: 'truncated' }).rotate();
    const out =
      format === 'png'
        ? await image.png().toBuffer()
        : format === 'webp'
          ? await image.webp({ quality: 90 }).toBuffer()
          : await image.jpeg({ quality: 90, mozjpeg: true }).toBuffer();
    return {
      kind: 'image',
      contentType: `image/${format}`,
      extension: format === 'jpeg' ? 'jpg' : format,
      data: out,
    };
  } catch {
    refuse('undecodable_image', `${label} could not be decoded; it may be damaged or cut short`);
  }
}

import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import exifr from 'exifr';
import sharp, { type Metadata, type OutputInfo } from 'sharp';
import { AppError, errors } from '../errors';

/**
 * Register photos: checked by their content (never by name or declared type), turned upright from their EXIF
 * orientation, downscaled, re-encoded as JPEG without any metadata (so no location leaves the server in a
 * file), with a thumbnail. Stored under generated names in `<uploadDir>/register-photos/`.
 */

/** Types accepted, by the content's own signature. */
export const PHOTO_TYPES: Readonly<Record<string, string>> = { 'image/jpeg': 'JPEG', 'image/png': 'PNG', 'image/webp': 'WebP' };

/**
 * Largest image accepted, in pixels: a 40-megapixel camera photo passes, anything much larger (or a
 * decompression bomb declaring huge dimensions) is refused from its header before it is decoded.
 */
export const MAX_INPUT_PIXELS = 50_000_000;
/** Long edge of the served image [px]: ample for a plant photo on any screen or page. */
export const SERVED_EDGE_PX = 2048;
export const THUMBNAIL_EDGE_PX = 320;

// One photo decoded at a time per process, no libvips cache and one libvips thread: a 40-megapixel photo then
// costs tens of megabytes, not hundreds, whatever else the server is doing.
sharp.cache(false);
sharp.concurrency(1);
let queue: Promise<unknown> = Promise.resolve();
function oneAtATime<T>(fn: () => Promise<T>): Promise<T> {
  const run = queue.then(fn, fn);
  queue = run.catch(() => undefined);
  return run;
}

type FileTypeModule = typeof import('file-type');
let fileTypeModule: Promise<FileTypeModule> | undefined;
/** file-type is ESM-only: loaded once, on first use. */
const loadFileType = () => (fileTypeModule ??= import('file-type'));

export type ProcessedPhoto = {
  image: Buffer;
  thumbnail: Buffer;
  width: number;
  height: number;
  originalType: string;
  originalWidth: number;
  originalHeight: number;
  takenAt: Date | null;
  latitude: number | null;
  longitude: number | null;
};

const refuse = (status: number, code: string, message: string, field: string) => new AppError(status, code, message, [{ code, message, field }]);

function exifDate(v: unknown): Date | null {
  const d = v instanceof Date ? v : typeof v === 'string' ? new Date(v) : null;
  return d && !Number.isNaN(d.getTime()) ? d : null;
}

/** Location and time the camera recorded, when it did (errors in EXIF never refuse a photo). */
async function readExif(buf: Buffer, keepLocation: boolean): Promise<Pick<ProcessedPhoto, 'takenAt' | 'latitude' | 'longitude'>> {
  let takenAt: Date | null = null;
  let latitude: number | null = null;
  let longitude: number | null = null;
  try {
    const tags = (await exifr.parse(buf, { pick: ['DateTimeOriginal', 'CreateDate'] })) as Record<string, unknown> | undefined;
    takenAt = exifDate(tags?.DateTimeOriginal) ?? exifDate(tags?.CreateDate);
  } catch {
    // no readable EXIF
  }
  if (keepLocation) {
    try {
      const gps = (await exifr.gps(buf)) as { latitude?: number; longitude?: number } | undefined;
      if (gps && Number.isFinite(gps.latitude) && Number.isFinite(gps.longitude)) {
        latitude = gps.latitude as number;
        longitude = gps.longitude as number;
      }
    } catch {
      // no readable location
    }
  }
  return { takenAt, latitude, longitude };
}

/**
 * Checks one uploaded file and makes the served image and its thumbnail.
 *
 * @param buf - the file as uploaded
 * @param opts - `name` (as uploaded, for messages), `field` (for errors), `keepLocation` (read GPS into metadata)
 * @returns the JPEG image and thumbnail, their size, what was uploaded, and the camera's time and location
 */
export async function processPhoto(buf: Buffer, opts: { name: string; field: string; keepLocation: boolean }): Promise<ProcessedPhoto> {
  const shown = opts.name ? `"${opts.name.slice(0, 80)}"` : 'The file';
  if (buf.length === 0) throw refuse(400, 'EMPTY_FILE', `${shown} is empty; take or choose the photo again.`, opts.field);
  const { fileTypeFromBuffer } = await loadFileType();
  const type = await fileTypeFromBuffer(buf);
  if (!type || !PHOTO_TYPES[type.mime]) {
    const found = type ? ` (its content is ${type.ext.toUpperCase()})` : '';
    throw refuse(415, 'UNSUPPORTED_PHOTO_TYPE', `${shown} is not a JPEG, PNG or WebP image${found}. Upload a photo.`, opts.field);
  }
  return oneAtATime(async () => {
    let meta: Metadata;
    try {
      meta = await sharp(buf, { limitInputPixels: false }).metadata();
    } catch {
      throw refuse(400, 'UNREADABLE_PHOTO', `${shown} could not be read as a ${PHOTO_TYPES[type.mime]} image; it may be damaged.`, opts.field);
    }
    const width = meta.width ?? 0;
    const height = meta.height ?? 0;
    if (width * height > MAX_INPUT_PIXELS) {
      const mp = Math.round((width * height) / 1e6);
      throw refuse(400, 'IMAGE_TOO_LARGE', `${shown} is ${width} × ${height} pixels (${mp} megapixels); at most ${MAX_INPUT_PIXELS / 1e6} megapixels are accepted.`, opts.field);
    }
    let image: { data: Buffer; info: OutputInfo };
    let thumbnail: Buffer;
    try {
      image = await sharp(buf, { limitInputPixels: MAX_INPUT_PIXELS })
        .rotate()
        .resize({ width: SERVED_EDGE_PX, height: SERVED_EDGE_PX, fit: 'inside', withoutEnlargement: true })
        .flatten({ background: '#ffffff' })
        .jpeg({ quality: 82 })
        .toBuffer({ resolveWithObject: true });
      thumbnail = await sharp(image.data).resize({ width: THUMBNAIL_EDGE_PX, height: THUMBNAIL_EDGE_PX, fit: 'inside' }).jpeg({ quality: 75 }).toBuffer();
    } catch {
      throw refuse(400, 'UNREADABLE_PHOTO', `${shown} could not be read as a ${PHOTO_TYPES[type.mime]} image; it may be damaged or cut short.`, opts.field);
    }
    const exif = await readExif(buf, opts.keepLocation);
    return {
      image: image.data,
      thumbnail,
      width: image.info.width,
      height: image.info.height,
      originalType: type.mime,
      originalWidth: width,
      originalHeight: height,
      ...exif,
    };
  });
}

const FOLDER = 'register-photos';
const SAFE_NAME = /^[a-f0-9]{32}(-thumb)?\.jpg$/;

/** Where a stored photo file lives; refuses anything that is not one of our generated names. */
export function photoPath(uploadDir: string, name: string): string {
  if (!SAFE_NAME.test(name)) throw errors.notFound('The photo');
  return path.join(uploadDir, FOLDER, name);
}

/**
 * Writes a processed photo under new generated names; returns them. `byContent` names the files after their
 * content instead (the demo seed: the same drawn photo is one file however often it is seeded).
 */
export async function writePhotoFiles(uploadDir: string, p: ProcessedPhoto, opts: { byContent?: boolean } = {}): Promise<{ fileName: string; thumbnailName: string }> {
  const base = opts.byContent ? crypto.createHash('sha256').update(p.image).digest('hex').slice(0, 32) : crypto.randomBytes(16).toString('hex');
  const fileName = `${base}.jpg`;
  const thumbnailName = `${base}-thumb.jpg`;
  const flag = opts.byContent ? 'w' : 'wx';
  await fs.mkdir(path.join(uploadDir, FOLDER), { recursive: true, mode: 0o750 });
  await fs.writeFile(photoPath(uploadDir, fileName), p.image, { flag, mode: 0o640 });
  try {
    await fs.writeFile(photoPath(uploadDir, thumbnailName), p.thumbnail, { flag, mode: 0o640 });
  } catch (e) {
    await fs.rm(photoPath(uploadDir, fileName), { force: true });
    throw e;
  }
  return { fileName, thumbnailName };
}

/** Removes stored files (after a failed save, or a deleted photo); missing files are fine. */
export async function removePhotoFiles(uploadDir: string, names: string[]): Promise<void> {
  await Promise.all(names.map((n) => fs.rm(photoPath(uploadDir, n), { force: true }).catch(() => undefined)));
}

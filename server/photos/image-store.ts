import { randomUUID } from 'node:crypto';
import { mkdir, readdir, rename, unlink, writeFile } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import pLimit from 'p-limit';
import sharp from 'sharp';
import { fileTypeFromFile } from 'file-type';
import { AppError } from '../core/app-error';

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const MAX_PHOTOS_PER_REQUEST = 10;
/** 50 megapixels: well above any phone or camera photo of a garment (a 48 MP phone photo fits), far below what a tiny file can claim. */
export const MAX_PHOTO_PIXELS = 50_000_000;

/** Where uploads are received, one file each, before they are checked; emptied at start. */
export const INCOMING_DIR = 'incoming';

/**
 * Decoding and re-encoding is the costly part of an upload. Each image is
 * worked on one libvips thread, and at most half the cores' worth of images at
 * once, whoever sent them; the rest wait their turn. This leaves a core for
 * everything else however many photos arrive together.
 */
sharp.concurrency(1);
export const IMAGE_WORKERS = Math.max(1, Math.floor(availableParallelism() / 2));
const imageWork = pLimit(IMAGE_WORKERS);
/** How many images are being worked on and how many wait (for tests and figures). */
export const imageWorkLoad = () => ({ active: imageWork.activeCount, waiting: imageWork.pendingCount });

const ACCEPTED: Record<string, { ext: string; format: 'jpeg' | 'png' | 'webp' }> = {
  'image/jpeg': { ext: 'jpg', format: 'jpeg' },
  'image/png': { ext: 'png', format: 'png' },
  'image/webp': { ext: 'webp', format: 'webp' },
};
const ACCEPTED_WORDS = 'JPEG, PNG and WebP photos';

export interface StoredImage {
  fileName: string;
  thumbName: string;
  mime: string;
  width: number;
  height: number;
  bytes: number;
  originalName: string;
}

/** A received file as multer's disk storage describes it: in INCOMING_DIR, removed by the caller afterwards. */
export interface UploadedFile {
  originalname: string;
  path: string;
  size: number;
}

/** A file name safe to keep as a label: no folders, no control characters. */
function cleanName(name: string): string {
  const base = path.basename(name.replace(/\\/g, '/'));
  return base.replace(/[\u0000-\u001f\u007f]/g, '').slice(0, 200) || 'photo';
}

const megapixels = (pixels: number) => `${Math.round(pixels / 1_000_000)} megapixels`;

/**
 * Checks each file's type from its first bytes and its size in pixels from its
 * header (before anything is decoded), re-encodes it (which drops EXIF and
 * GPS location), makes a thumbnail and writes both under random names. Any
 * failure removes every file written so far and throws a message naming the file.
 */
export async function storeImages(dir: string, files: UploadedFile[]): Promise<StoredImage[]> {
  if (files.length === 0) throw new AppError(400, 'upload_rejected', `Choose at least one photo to upload (${ACCEPTED_WORDS}).`);
  await mkdir(dir, { recursive: true });
  const written: string[] = [];
  try {
    const out: StoredImage[] = [];
    for (const file of files) {
      const label = cleanName(file.originalname);
      if (file.size === 0) throw new AppError(400, 'upload_rejected', `"${label}" is empty.`);
      const type = await fileTypeFromFile(file.path);
      const accepted = type ? ACCEPTED[type.mime] : undefined;
      if (!accepted) {
        const what = type ? `a ${type.ext.toUpperCase()} file` : 'not a photo Keepstitch can read';
        throw new AppError(415, 'unsupported_type', `"${label}" is ${what}. Keepstitch accepts ${ACCEPTED_WORDS}.`);
      }
      const unreadable = () => new AppError(400, 'unreadable_image', `"${label}" could not be read as a photo; it may be damaged or only partly uploaded.`);
      const header = await sharp(file.path).metadata().catch(() => {
        throw unreadable();
      });
      const pixels = (header.width ?? 0) * (header.height ?? 0);
      if (pixels > MAX_PHOTO_PIXELS) {
        throw new AppError(
          413,
          'too_many_pixels',
          `"${label}" is ${header.width} × ${header.height} pixels (${megapixels(pixels)}); Keepstitch accepts photos of at most ${megapixels(MAX_PHOTO_PIXELS)}. Make it smaller and try again.`,
        );
      }
      const { image, thumb } = await imageWork(async () => {
        try {
          const pipeline = sharp(file.path, { failOn: 'truncated', limitInputPixels: MAX_PHOTO_PIXELS })
            .rotate()
            .resize({ width: 4000, height: 4000, fit: 'inside', withoutEnlargement: true });
          return {
            image: await pipeline.clone().toFormat(accepted.format, { quality: 88 }).toBuffer({ resolveWithObject: true }),
            thumb: await pipeline.clone().resize({ width: 480, height: 480, fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer(),
          };
        } catch {
          throw unreadable();
        }
      });
      const id = randomUUID();
      const fileName = `${id}.${accepted.ext}`;
      const thumbName = `${id}.thumb.webp`;
      for (const [name, data] of [[fileName, image.data], [thumbName, thumb]] as const) {
        const temp = path.join(dir, `${name}.part`);
        written.push(temp);
        await writeFile(temp, data, { flag: 'wx' });
        await rename(temp, path.join(dir, name));
        written[written.length - 1] = path.join(dir, name);
      }
      out.push({ fileName, thumbName, mime: type!.mime, width: image.info.width, height: image.info.height, bytes: image.data.length, originalName: label });
    }
    return out;
  } catch (err) {
    await removeFiles(written);
    throw err;
  }
}

/** Stores one image held in memory (the demo seeds), through INCOMING_DIR like an upload. */
export async function storeImageBuffer(dir: string, originalname: string, data: Buffer): Promise<StoredImage> {
  await mkdir(path.join(dir, INCOMING_DIR), { recursive: true });
  const received = path.join(dir, INCOMING_DIR, `${randomUUID()}.upload`);
  await writeFile(received, data, { flag: 'wx' });
  try {
    const [image] = await storeImages(dir, [{ originalname, path: received, size: data.length }]);
    return image!;
  } finally {
    await removeFiles([received]);
  }
}

export async function removeFiles(paths: string[]): Promise<void> {
  await Promise.all(paths.map((p) => unlink(p).catch(() => undefined)));
}

/** Removes what uploads cut off by a stop left in INCOMING_DIR; run at start, before any upload. */
export async function emptyIncoming(uploadDir: string): Promise<string[]> {
  const dir = path.join(uploadDir, INCOMING_DIR);
  const names = await readdir(dir).catch(() => [] as string[]);
  await removeFiles(names.map((n) => path.join(dir, n)));
  return names;
}

import { randomUUID } from 'node:crypto';
import { mkdir, rename, unlink, writeFile } from 'node:fs/promises';
import path from 'node:path';
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from '../core/app-error';

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024;
export const MAX_PHOTOS_PER_REQUEST = 10;

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

export interface UploadedFile {
  originalname: string;
  buffer: Buffer;
}

/** A file name safe to keep as a label: no folders, no control characters. */
function cleanName(name: string): string {
  const base = path.basename(name.replace(/\\/g, '/'));
  return base.replace(/[\u0000-\u001f\u007f]/g, '').slice(0, 200) || 'photo';
}

/**
 * Checks each file's type from its bytes, re-encodes it (which drops EXIF and
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
      if (file.buffer.length === 0) throw new AppError(400, 'upload_rejected', `"${label}" is empty.`);
      const type = await fileTypeFromBuffer(file.buffer);
      const accepted = type ? ACCEPTED[type.mime] : undefined;
      if (!accepted) {
        const what = type ? `a ${type.ext.toUpperCase()} file` : 'not a photo Keepstitch can read';
        throw new AppError(415, 'unsupported_type', `"${label}" is ${what}. Keepstitch accepts ${ACCEPTED_WORDS}.`);
      }
      let image: { data: Buffer; info: sharp.OutputInfo };
      let thumb: Buffer;
      try {
        const pipeline = sharp(file.buffer, { failOn: 'truncated', limitInputPixels: 100_000_000 })
          .rotate()
          .resize({ width: 4000, height: 4000, fit: 'inside', withoutEnlargement: true });
        image = await pipeline.clone().toFormat(accepted.format, { quality: 88 }).toBuffer({ resolveWithObject: true });
        thumb = await pipeline.clone().resize({ width: 480, height: 480, fit: 'inside', withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
      } catch {
        throw new AppError(400, 'unreadable_image', `"${label}" could not be read as a photo; it may be damaged or only partly uploaded.`);
      }
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

export async function removeFiles(paths: string[]): Promise<void> {
  await Promise.all(paths.map((p) => unlink(p).catch(() => undefined)));
}

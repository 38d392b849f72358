import { mkdir, readdir, rename, unlink } from 'node:fs/promises';
import path from 'node:path';
import { AppError } from '../core/app-error';
import { CommissionModel } from '../models/commission-model';
import { findVisibleCommission, findVisibleGarment } from '../commissions/commission-access';
import { PhotoModel } from '../models/photo-model';
import { emptyIncoming, INCOMING_DIR, removeFiles, storeImages, type UploadedFile } from './image-store';

/** Stores photos and their rows together: if the rows cannot be written, the files go too. */
async function save(uploadDir: string, files: UploadedFile[], row: Pick<PhotoModel, 'commissionId' | 'garmentId' | 'kind' | 'uploadedBy'>, caption: string | null) {
  const images = await storeImages(uploadDir, files);
  try {
    const photos: PhotoModel[] = await PhotoModel.query()
      .insert(images.map((img) => ({ ...img, ...row, caption })))
      .returning('*');
    return photos.map((p) => p.toPublic());
  } catch (err) {
    await removeFiles(images.flatMap((i) => [path.join(uploadDir, i.fileName), path.join(uploadDir, i.thumbName)]));
    throw err;
  }
}

export async function addGarmentPhotos(user: Express.User, garmentId: number, files: UploadedFile[], caption: string | null, uploadDir: string) {
  const { garment } = await findVisibleGarment(user, garmentId);
  return save(uploadDir, files, { commissionId: garment.commissionId, garmentId, kind: 'garment', uploadedBy: user.id }, caption);
}

export async function addProgressPhotos(user: Express.User, commissionId: number, files: UploadedFile[], caption: string | null, uploadDir: string) {
  await findVisibleCommission(user, commissionId);
  return save(uploadDir, files, { commissionId, garmentId: null, kind: 'progress', uploadedBy: user.id }, caption);
}

/** The stored file of a photo the user may see. */
export async function photoFile(user: Express.User, id: number, which: 'image' | 'thumb', uploadDir: string) {
  const photo = await PhotoModel.query().findById(id);
  if (!photo) throw AppError.notFound('That photo');
  const visible = await CommissionModel.query().modify('visibleTo', user).findById(photo.commissionId);
  if (!visible) throw AppError.notFound('That photo');
  return which === 'image'
    ? { path: path.join(uploadDir, photo.fileName), mime: photo.mime }
    : { path: path.join(uploadDir, photo.thumbName), mime: 'image/webp' };
}

/** Where stored photo files without a row are moved at start-up, to be looked at rather than lost. */
export const UNCLAIMED_DIR = 'unclaimed';

/**
 * Tidies what an interrupted upload can leave in the photo folder, at start-up
 * before any upload can be in flight: files still being received (in
 * INCOMING_DIR) and half-written ".part" files are removed;
 * stored files that no photo row names (their row was never committed) are
 * moved into an "unclaimed" folder beside them, never deleted, since a folder
 * shared with another database must not lose a client's photos.
 */
export async function removeOrphanFiles(uploadDir: string): Promise<{ removed: string[]; unclaimed: string[] }> {
  const incoming = (await emptyIncoming(uploadDir)).map((n) => `${INCOMING_DIR}/${n}`);
  const names = await readdir(uploadDir).catch(() => [] as string[]);
  if (!names.length) return { removed: incoming, unclaimed: [] };
  const rows = await PhotoModel.query().select('fileName', 'thumbName');
  const kept = new Set(rows.flatMap((r) => [r.fileName, r.thumbName]));
  const removed = names.filter((n) => n.endsWith('.part'));
  const unclaimed = names.filter((n) => /^[0-9a-f-]{36}(\.thumb)?\.(jpg|png|webp)$/.test(n) && !kept.has(n));
  await Promise.all(removed.map((n) => unlink(path.join(uploadDir, n)).catch(() => undefined)));
  if (unclaimed.length) {
    await mkdir(path.join(uploadDir, UNCLAIMED_DIR), { recursive: true });
    await Promise.all(unclaimed.map((n) => rename(path.join(uploadDir, n), path.join(uploadDir, UNCLAIMED_DIR, n)).catch(() => undefined)));
  }
  return { removed: [...incoming, ...removed], unclaimed };
}

import { randomUUID } from 'node:crypto';
import { PHOTO_TEXT_LIMITS } from '@keepstitch/shared';
import { mkdir } from 'node:fs/promises';
import path from 'node:path';
import multer from 'multer';
import { AppError } from '../core/app-error';
import { securedRouter, signedInUser } from '../core/secured-router';
import { BAD_TEXT_MESSAGE, hasBadText, parseId } from '../core/validate';
import { INCOMING_DIR, MAX_PHOTO_BYTES, MAX_PHOTOS_PER_REQUEST, removeFiles } from './image-store';
import * as photos from './photos-service';

export function photosRouter(uploadDir: string) {
  const incoming = path.join(uploadDir, INCOMING_DIR);
  const upload = multer({
    // Each file streams to disk as it arrives (never held whole in memory); the handler removes it once checked and stored.
    storage: multer.diskStorage({
      destination: (_req, _file, done) => void mkdir(incoming, { recursive: true }).then(() => done(null, incoming), (err: Error) => done(err, incoming)),
      filename: (_req, _file, done) => done(null, `${randomUUID()}.upload`),
    }),
    // Browsers send file names as UTF-8 without saying so; busboy would read them as latin1 ("ñ" as "Ã±").
    defParamCharset: 'utf8',
    limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_PHOTOS_PER_REQUEST, fields: 5, fieldSize: 2000, parts: MAX_PHOTOS_PER_REQUEST + 5 },
  }).array('photos', MAX_PHOTOS_PER_REQUEST);

  const caption = (body: unknown): string | null => {
    const c = (body as { caption?: unknown } | undefined)?.caption;
    if (typeof c === 'string' && hasBadText(c)) throw new AppError(400, 'validation', 'The caption has a character to remove.', { caption: BAD_TEXT_MESSAGE });
    return typeof c === 'string' && c.trim() ? c.trim().slice(0, PHOTO_TEXT_LIMITS.caption) : null;
  };
  const files = (req: Express.Request) => (req.files as Express.Multer.File[] | undefined) ?? [];
  /** Runs a handler with the received files, removing them from INCOMING_DIR afterwards whatever happened. */
  const received = async <T>(req: Express.Request, work: (files: Express.Multer.File[]) => Promise<T>): Promise<T> => {
    try {
      return await work(files(req));
    } finally {
      await removeFiles(files(req).map((f) => f.path));
    }
  };

  const garments = securedRouter('/api/garments');
  garments.post('/:id/photos', upload, async (req, res) => {
    const items = await received(req, (list) => photos.addGarmentPhotos(signedInUser(req), parseId(req.params['id'], 'That garment'), list, caption(req.body), uploadDir));
    res.status(201).json({ items });
  });

  const commissions = securedRouter('/api/commissions');
  commissions.post('/:id/photos', upload, async (req, res) => {
    const items = await received(req, (list) => photos.addProgressPhotos(signedInUser(req), parseId(req.params['id'], 'That commission'), list, caption(req.body), uploadDir));
    res.status(201).json({ items });
  });

  const r = securedRouter('/api/photos');
  for (const which of ['image', 'thumb'] as const) {
    r.get(`/:id/${which}`, async (req, res) => {
      const file = await photos.photoFile(signedInUser(req), parseId(req.params['id'], 'That photo'), which, uploadDir);
      // Never kept by the browser: after signing out on a shared computer, a client's photos must not show from its cache.
      res.setHeader('Cache-Control', 'no-store');
      res.type(file.mime).sendFile(file.path, { dotfiles: 'allow' });
    });
  }
  return [garments.router, commissions.router, r.router];
}

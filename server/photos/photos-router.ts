import multer from 'multer';
import { securedRouter } from '../core/secured-router';
import { parseId } from '../core/validate';
import { MAX_PHOTO_BYTES, MAX_PHOTOS_PER_REQUEST } from './image-store';
import * as photos from './photos-service';

export function photosRouter(uploadDir: string) {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: MAX_PHOTO_BYTES, files: MAX_PHOTOS_PER_REQUEST, fields: 5, fieldSize: 2000, parts: MAX_PHOTOS_PER_REQUEST + 5 },
  }).array('photos', MAX_PHOTOS_PER_REQUEST);

  const caption = (body: unknown): string | null => {
    const c = (body as { caption?: unknown } | undefined)?.caption;
    return typeof c === 'string' && c.trim() ? c.trim().slice(0, 500) : null;
  };
  const files = (req: Express.Request) => (req.files as Express.Multer.File[] | undefined) ?? [];

  const garments = securedRouter('/api/garments');
  garments.post('/:id/photos', upload, async (req, res) => {
    const id = parseId(req.params['id'], 'That garment');
    res.status(201).json({ items: await photos.addGarmentPhotos(req.user!, id, files(req), caption(req.body), uploadDir) });
  });

  const commissions = securedRouter('/api/commissions');
  commissions.post('/:id/photos', upload, async (req, res) => {
    const id = parseId(req.params['id'], 'That commission');
    res.status(201).json({ items: await photos.addProgressPhotos(req.user!, id, files(req), caption(req.body), uploadDir) });
  });

  const r = securedRouter('/api/photos');
  for (const which of ['image', 'thumb'] as const) {
    r.get(`/:id/${which}`, async (req, res) => {
      const file = await photos.photoFile(req.user!, parseId(req.params['id'], 'That photo'), which, uploadDir);
      res.setHeader('Cache-Control', 'private, max-age=3600');
      res.type(file.mime).sendFile(file.path, { dotfiles: 'allow' });
    });
  }
  return [garments.router, commissions.router, r.router];
}

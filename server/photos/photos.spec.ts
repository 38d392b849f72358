import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import exifReader from 'exif-reader';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { removeOrphanFiles } from './photos-service';
import { IMAGE_WORKERS, imageWorkLoad, INCOMING_DIR } from './image-store';

async function jpegWithGps(): Promise<Buffer> {
  return sharp({ create: { width: 320, height: 240, channels: 3, background: '#4a6fa5' } })
    .jpeg()
    .withExif({ IFD0: { Copyright: 'Test' }, IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
    .toBuffer();
}

describe('photo uploads', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let clientA: ApiAgent;
  let clientB: ApiAgent;
  let garmentId: number;
  let commissionId: number;

  /** Every file in the photo folder, and any left in its incoming area. */
  const stored = () => {
    const incoming = path.join(t.uploadDir, INCOMING_DIR);
    const left = existsSync(incoming) ? readdirSync(incoming).map((n) => `${INCOMING_DIR}/${n}`) : [];
    return [...readdirSync(t.uploadDir, { withFileTypes: true }).filter((e) => e.isFile()).map((e) => e.name), ...left].sort();
  };
  /** A multipart body written by hand, for file names a client library would escape. */
  const rawUpload = (agent: ApiAgent, fileName: string, data: Buffer) => {
    const boundary = 'ks-boundary-7d1f';
    const body = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="${fileName}"\r\nContent-Type: image/jpeg\r\n\r\n`, 'utf8'),
      data,
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    return agent.agent.post(`/api/garments/${garmentId}/photos`).set('X-XSRF-TOKEN', agent.csrf).set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(body);
  };
  const rows = async () => Number(((await t.knex('photos').count({ n: '*' }).first()) as { n: string }).n);
  const upload = (agent: ApiAgent, files: Array<[Buffer, string]>, url = `/api/garments/${garmentId}/photos`) => {
    let req = agent.agent.post(url).set('X-XSRF-TOKEN', agent.csrf);
    for (const [buf, name] of files) req = req.attach('photos', buf, name);
    return req;
  };

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const a = await addUser(t.knex, 'client');
    clientA = await signedIn(t.app, a.email);
    clientB = await signedIn(t.app, (await addUser(t.knex, 'client')).email);
    commissionId = await addCommission(t.knex, a.clientId!);
    const [g] = await t.knex('garments').insert({ commissionId, description: 'Blue work shirt' }).returning('id');
    garmentId = g.id;
  });
  afterAll(() => t.close());

  it('stores a re-encoded photo with a thumbnail and removes its GPS location', async () => {
    const original = await jpegWithGps();
    expect(exifReader((await sharp(original).metadata()).exif!).GPSInfo).toMatchObject({ GPSLatitudeRef: 'N' });
    const res = await upload(clientA, [[original, 'IMG_0042.jpg']]);
    expect(res.status).toBe(201);
    const [photo] = res.body.items;
    expect(photo).toMatchObject({ originalName: 'IMG_0042.jpg', width: 320, height: 240, url: `/api/photos/${photo.id}/image` });
    const row = await t.knex('photos').where('id', photo.id).first();
    expect(row.fileName).toMatch(/^[0-9a-f-]{36}\.jpg$/);
    const saved = readFileSync(path.join(t.uploadDir, row.fileName));
    expect((await sharp(saved).metadata()).exif).toBeUndefined();
    expect(saved.includes(Buffer.from('GPS'))).toBe(false);
    const image = await clientA.agent.get(photo.url);
    expect(image.status).toBe(200);
    expect(image.headers['content-type']).toBe('image/jpeg');
    const thumb = await clientA.agent.get(photo.thumbUrl);
    expect(thumb.headers['content-type']).toBe('image/webp');
    expect((await sharp(thumb.body as Buffer).metadata()).width).toBeLessThanOrEqual(480);
  });

  it('serves a photo only to those who may see its commission', async () => {
    const [photo] = (await upload(owner, [[await jpegWithGps(), 'a.jpg']])).body.items;
    expect((await clientB.agent.get(photo.url)).status).toBe(404);
    expect((await clientB.agent.get(photo.thumbUrl)).status).toBe(404);
    expect((await new ApiAgent(t.app).agent.get(photo.url)).status).toBe(401);
    expect((await upload(clientB, [[await jpegWithGps(), 'b.jpg']])).status).toBe(404);
  });

  describe('hostile uploads are refused with a clear message and leave nothing behind', () => {
    const cases: Array<[string, () => Promise<Array<[Buffer, string]>>, number, RegExp]> = [
      ['a text file renamed to .jpg', async () => [[Buffer.from('just some text, not a photo at all'), 'holiday.jpg']], 415, /accepts JPEG, PNG and WebP/],
      ['an SVG with a script', async () => [[Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'x.svg']], 415, /accepts JPEG, PNG and WebP/],
      ['a zero-byte file', async () => [[Buffer.alloc(0), 'empty.jpg']], 400, /is empty/],
      ['a truncated JPEG', async () => { const b = await jpegWithGps(); return [[b.subarray(0, Math.floor(b.length / 2)), 'cut.jpg']]; }, 400, /damaged or only partly uploaded/],
      ['a 20 MB file', async () => [[Buffer.alloc(20 * 1024 * 1024, 1), 'big.jpg']], 413, /at most 15 MB/],
      ['eleven files', async () => { const b = await jpegWithGps(); return Array.from({ length: 11 }, (_, i) => [b, `p${i}.jpg`] as [Buffer, string]); }, 400, /at most 10 photos/],
      ['a GIF', async () => [[await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000' } }).gif().toBuffer(), 'anim.gif']], 415, /is a GIF file/],
      ['no file at all', async () => [], 400, /Choose at least one photo/],
      // 64 megapixels in a few kilobytes: decoding it would take seconds of CPU and 200 MB of memory.
      ['an 8000 x 8000 PNG', async () => [[await sharp({ create: { width: 8000, height: 8000, channels: 3, background: '#fff' } }).png({ compressionLevel: 9 }).toBuffer(), 'huge.png']], 413, /"huge.png" is 8000 × 8000 pixels \(64 megapixels\); Keepstitch accepts photos of at most 50 megapixels/],
    ];
    it.each(cases)('%s', async (_name, files, status, message) => {
      const before = { files: stored(), rows: await rows() };
      const res = await upload(clientA, await files());
      expect(res.status).toBe(status);
      expect(res.body.error.message).toMatch(message);
      expect(stored()).toEqual(before.files);
      expect(await rows()).toBe(before.rows);
    });

    it('keeps a path-traversal file name only as a harmless label', async () => {
      const res = await upload(clientA, [[await jpegWithGps(), '../../etc/passwd.jpg']]);
      expect(res.status).toBe(201);
      expect(res.body.items[0].originalName).toBe('passwd.jpg');
      expect(stored().every((f) => /^[0-9a-f-]{36}(\.thumb)?\.(jpg|webp)$/.test(f))).toBe(true);
    });

    it('refuses a file name holding a control character with a 400 that says to rename it', async () => {
      const before = { files: stored(), rows: await rows() };
      const res = await rawUpload(clientA, 'bad\u0001name.jpg', await jpegWithGps());
      expect(res.status).toBe(400);
      expect(res.body.error.message).toMatch(/rename the file/);
      expect(stored()).toEqual(before.files);
      expect(await rows()).toBe(before.rows);
    });

    it('refuses a caption holding a NUL byte, keeping nothing', async () => {
      const before = { files: stored(), rows: await rows() };
      const res = await clientA.agent.post(`/api/garments/${garmentId}/photos`).set('X-XSRF-TOKEN', clientA.csrf).field('caption', 'Front\u0000 pocket').attach('photos', await jpegWithGps(), 'a.jpg');
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ caption: expect.stringMatching(/control character/) });
      expect(stored()).toEqual(before.files);
      expect(await rows()).toBe(before.rows);
    });

    it('rejects the whole request when one of several files is bad, keeping none', async () => {
      const before = { files: stored(), rows: await rows() };
      const res = await upload(clientA, [[await jpegWithGps(), 'good.jpg'], [Buffer.from('nope'), 'bad.png']]);
      expect(res.status).toBe(415);
      expect(res.body.error.message).toMatch(/"bad.png"/);
      expect(stored()).toEqual(before.files);
      expect(await rows()).toBe(before.rows);
    });
  });

  it('keeps a file name in other scripts as it was typed', async () => {
    for (const name of ['colcha-niño.jpg', 'ñandú ü 縫.jpg']) {
      const viaClient = await upload(clientA, [[await jpegWithGps(), name]]);
      expect(viaClient.body.items[0].originalName).toBe(name);
      const viaRawUtf8 = await rawUpload(clientA, name, await jpegWithGps());
      expect(viaRawUtf8.body.items[0].originalName).toBe(name);
    }
  });

  it('tells the browser never to keep a photo, so signing out on a shared computer leaves none to show', async () => {
    const [photo] = (await upload(clientA, [[await jpegWithGps(), 'a.jpg']])).body.items;
    for (const url of [photo.url, photo.thumbUrl]) {
      const res = await clientA.agent.get(url);
      expect(res.status).toBe(200);
      expect(res.headers['cache-control']).toBe('no-store');
    }
  });

  it('receives files onto disk and leaves nothing in the incoming area once stored', async () => {
    const res = await upload(clientA, [[await jpegWithGps(), 'a.jpg'], [await jpegWithGps(), 'b.jpg']]);
    expect(res.status).toBe(201);
    expect(readdirSync(path.join(t.uploadDir, INCOMING_DIR))).toEqual([]);
  });

  it('works on at most IMAGE_WORKERS images at once, whoever sent them; the others wait their turn', async () => {
    const big = await sharp({ create: { width: 1600, height: 1200, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } }).jpeg().toBuffer();
    const seen = { active: 0, waiting: 0 };
    const sample = setInterval(() => {
      const load = imageWorkLoad();
      seen.active = Math.max(seen.active, load.active);
      seen.waiting = Math.max(seen.waiting, load.waiting);
    }, 2);
    try {
      const answers = await Promise.all([owner, clientA, owner].map((agent) => upload(agent, [[big, 'wide.jpg'], [big, 'wide2.jpg']])));
      expect(answers.map((a) => a.status)).toEqual([201, 201, 201]);
    } finally {
      clearInterval(sample);
    }
    expect(seen.active).toBeGreaterThan(0);
    expect(seen.active).toBeLessThanOrEqual(IMAGE_WORKERS);
    expect(seen.waiting).toBeGreaterThan(0);
  }, 60_000);

  it('takes progress photos from the studio only', async () => {
    const png = await sharp({ create: { width: 50, height: 40, channels: 4, background: '#ffffff80' } }).png().toBuffer();
    const res = await upload(owner, [[png, 'progress.png']], `/api/commissions/${commissionId}/photos`);
    expect(res.status).toBe(201);
    expect(res.body.items[0]).toMatchObject({ kind: 'progress', garmentId: null });
    expect((await upload(clientA, [[png, 'p.png']], `/api/commissions/${commissionId}/photos`)).status).toBe(403);
    const detail = await clientA.get(`/api/commissions/${commissionId}`);
    expect(detail.body.progressPhotos.map((p: { id: number }) => p.id)).toContain(res.body.items[0].id);
  });
});

describe('photo folder clean-up at start', () => {
  it('removes half-written and half-received files, moves files no photo row names aside, and keeps the rest', async () => {
    const t = await startTestApp();
    try {
      const owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
      const c = await addUser(t.knex, 'client');
      const commission = await addCommission(t.knex, c.clientId!);
      const [g] = await t.knex('garments').insert({ commissionId: commission, description: 'Shirt' }).returning('id');
      const res = await owner.agent.post(`/api/garments/${g.id}/photos`).set('X-XSRF-TOKEN', owner.csrf).attach('photos', await jpegWithGps(), 'a.jpg');
      expect(res.status).toBe(201);
      const kept = readdirSync(t.uploadDir).sort();
      writeFileSync(path.join(t.uploadDir, '3f2504e0-4f89-11d3-9a0c-0305e82c3301.jpg.part'), 'half');
      writeFileSync(path.join(t.uploadDir, '3f2504e0-4f89-11d3-9a0c-0305e82c3302.jpg'), 'no row');
      writeFileSync(path.join(t.uploadDir, 'README.txt'), 'not ours');
      writeFileSync(path.join(t.uploadDir, INCOMING_DIR, 'cut-short.upload'), 'half received');
      const tidy = await removeOrphanFiles(t.uploadDir);
      expect(tidy).toEqual({ removed: [`${INCOMING_DIR}/cut-short.upload`, '3f2504e0-4f89-11d3-9a0c-0305e82c3301.jpg.part'], unclaimed: ['3f2504e0-4f89-11d3-9a0c-0305e82c3302.jpg'] });
      expect(readdirSync(path.join(t.uploadDir, INCOMING_DIR))).toEqual([]);
      expect(readdirSync(t.uploadDir).sort()).toEqual([...kept, 'README.txt', 'unclaimed'].sort());
      expect(readFileSync(path.join(t.uploadDir, 'unclaimed', '3f2504e0-4f89-11d3-9a0c-0305e82c3302.jpg'), 'utf8')).toBe('no row');
    } finally {
      await t.close();
    }
  });
});

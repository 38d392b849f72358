/**
 * npm run fault:upload — the server killed (SIGKILL) in the middle of photo
 * uploads and started again. The real server runs as its own process against
 * a database of this run's own (scripts/with-fault-db.sh makes it). It is
 * killed twice: with half the body of a large, slowly sent garment photo
 * received, and as the first photo of a whole three-photo upload is stored
 * (renamed from its .part file), before any row is written. After each start
 * it checks the folder against the photo rows: no half-written (.part) file
 * and no photo file without its row at the top level (the start-up tidy moves
 * those to unclaimed/), no row without both its files, and every photo stored
 * before still in place, byte for byte, and served. Then one more upload must
 * be stored and served.
 */
import { createHash } from 'node:crypto';
import { watch } from 'node:fs';
import { readdir, readFile } from 'node:fs/promises';
import http from 'node:http';
import path from 'node:path';
import sharp from 'sharp';
import { UNCLAIMED_DIR } from '../server/photos/photos-service';
import { addCommission } from '../server/testing/fixtures';
import { addUser, signedIn, type ApiAgent } from '../server/testing/test-app';
import { migratedDatabase, run, serverEnv, startServer, verdict, type ServerProcess } from './fault-lib';

const env = serverEnv(Number(process.env['FAULT_PORT'] ?? 4461));
const uploadDir = env['UPLOAD_DIR']!;
const PHOTO_FILE = /^[0-9a-f-]{36}(\.thumb)?\.(jpg|png|webp)(\.part)?$/;

/** A noisy JPEG, which compresses badly: about 0.7 MB a megapixel. */
const photo = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 3, background: '#6b7f99', noise: { type: 'gaussian', mean: 128, sigma: 40 } } }).jpeg({ quality: 90 }).toBuffer();

function multipart(files: Array<[string, Buffer]>) {
  const boundary = 'keepstitch-fault-upload';
  const parts = files.flatMap(([name, data]) => [Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="photos"; filename="${name}"\r\nContent-Type: image/jpeg\r\n\r\n`), data, Buffer.from('\r\n')]);
  return { type: `multipart/form-data; boundary=${boundary}`, body: Buffer.concat([...parts, Buffer.from(`--${boundary}--\r\n`)]) };
}

/**
 * Posts photos as the browser does, all at once or `pace.bytes` every
 * `pace.everyMs`, telling `pace.sent` how far it has got. Resolves with the
 * answer, or with how the request was cut off.
 */
function upload(base: string, url: string, agent: ApiAgent, files: Array<[string, Buffer]>, pace?: { bytes: number; everyMs: number; sent: (bytes: number, of: number) => void }) {
  const { type, body } = multipart(files);
  return new Promise<{ status: number; body: any; outcome: string }>((resolve) => {
    const req = http.request(`${base}${url}`, { method: 'POST', headers: { ...agent.headers, 'Content-Type': type, 'Content-Length': body.length } }, (res) => {
      let text = '';
      res.setEncoding('utf8').on('data', (c: string) => (text += c));
      res.on('end', () => resolve({ status: res.statusCode!, body: JSON.parse(text || 'null'), outcome: `answered ${res.statusCode}` }));
      res.on('error', (err) => resolve({ status: 0, body: null, outcome: `cut off in the answer (${err.message})` }));
    });
    req.on('error', (err: NodeJS.ErrnoException) => resolve({ status: 0, body: null, outcome: `cut off (${err.code ?? err.message})` }));
    if (!pace) return void req.end(body);
    let at = 0;
    const timer = setInterval(() => {
      if (req.destroyed) return clearInterval(timer);
      const chunk = body.subarray(at, at + pace.bytes);
      at += chunk.length;
      if (at < body.length) req.write(chunk);
      else {
        clearInterval(timer);
        req.end(chunk);
      }
      pace.sent(at, body.length);
    }, pace.everyMs);
  });
}

const sha = (data: Buffer) => createHash('sha256').update(data).digest('hex');
const list = (dir: string) => readdir(dir, { withFileTypes: true }).then((es) => es.filter((e) => e.isFile()).map((e) => e.name), () => [] as string[]);

async function main(): Promise<void> {
  const knex = migratedDatabase(env);
  const { email } = await addUser(knex, 'owner');
  const [client] = await knex('clients').insert({ name: 'Orla Pennant' }).returning('id');
  const commission = await addCommission(knex, client.id, { title: 'Rugby shirt quilt' });
  const [garment] = await knex('garments').insert({ commissionId: commission, description: 'Striped rugby shirt' }).returning('id');
  const url = `/api/garments/${garment.id}/photos`;
  const [large, ...small] = await Promise.all([photo(3000, 2000), photo(1600, 1200), photo(1600, 1200), photo(1600, 1200)]);
  const checks: Array<[string, boolean]> = [];
  let server: ServerProcess = await startServer(env);
  let owner = await signedIn(server.base, email);

  /** The files of the photos stored before the kills, with their hashes. */
  const storedBefore = new Map<string, string>();
  const first = await upload(server.base, url, owner, [['before-1.jpg', small[0]!], ['before-2.jpg', small[1]!]]);
  checks.push(['two photos stored before the kills (201)', first.status === 201]);
  for (const row of await knex('photos').select('fileName', 'thumbName')) {
    for (const name of [row.fileName, row.thumbName]) storedBefore.set(name, sha(await readFile(path.join(uploadDir, name))));
  }

  /** Checks the photo folder against the photo rows, and that the photos stored before are still served. */
  async function checkFolder(label: string) {
    const names = (await list(uploadDir)).filter((n) => PHOTO_FILE.test(n));
    const rows = await knex('photos').select('id', 'fileName', 'thumbName');
    const named = new Set(rows.flatMap((r) => [r.fileName, r.thumbName]));
    const parts = names.filter((n) => n.endsWith('.part'));
    const withoutRow = names.filter((n) => !n.endsWith('.part') && !named.has(n));
    const rowsWithoutFiles = rows.filter((r) => !names.includes(r.fileName) || !names.includes(r.thumbName));
    const unclaimed = await list(path.join(uploadDir, UNCLAIMED_DIR));
    let intact = 0;
    for (const [name, hash] of storedBefore) if (names.includes(name) && sha(await readFile(path.join(uploadDir, name))) === hash) intact++;
    const served = await Promise.all(rows.filter((r) => storedBefore.has(r.fileName)).map((r) => owner.get(`/api/photos/${r.id}/image`).then((res) => res.status)));
    console.log(`  photo rows ${rows.length}; .part files ${parts.length}; photo files without a row ${withoutRow.length}; rows without their files ${rowsWithoutFiles.length}; moved to ${UNCLAIMED_DIR}/ so far ${unclaimed.length}`);
    console.log(`  files stored before, in place and unchanged: ${intact} of ${storedBefore.size}; their photos served: ${served.join(', ')}`);
    checks.push(
      [`${label}: no .part file left`, parts.length === 0],
      [`${label}: no photo file without its row`, withoutRow.length === 0],
      [`${label}: no row without its files`, rowsWithoutFiles.length === 0],
      [`${label}: every file stored before in place and unchanged`, intact === storedBefore.size && !unclaimed.some((n) => storedBefore.has(n))],
      [`${label}: every photo stored before served`, served.length === storedBefore.size / 2 && served.every((s) => s === 200)],
    );
  }

  /** Runs an upload that `cut` kills the server during, starts the server again and checks. */
  async function killAndCheck(label: string, cut: () => Promise<string>) {
    const outcome = await cut();
    const left = (await list(uploadDir)).filter((n) => PHOTO_FILE.test(n) && !storedBefore.has(n));
    const at = Date.now();
    server = await startServer(env);
    const seconds = (Date.now() - at) / 1000;
    owner = await signedIn(server.base, email);
    console.log(`\n${label}: ${outcome}`);
    console.log(`  on disk at the kill, besides the photos stored before: ${left.join(', ') || 'nothing'}`);
    console.log(`  started again in ${seconds.toFixed(1)} s, saying: ${server.output.filter((l) => /half-written|unclaimed/.test(l)).join(' ') || 'nothing to tidy'}`);
    await checkFolder(label);
  }

  try {
    await killAndCheck(`Killed with half of a ${(large!.length / 1e6).toFixed(1)} MB photo received`, async () => {
      let killed: Promise<void> | undefined;
      let sentAtKill = '';
      const answer = await upload(server.base, url, owner, [['large.jpg', large!]], {
        bytes: 64 * 1024,
        everyMs: 25,
        sent: (bytes, of) => {
          if (killed || bytes < of / 2) return;
          sentAtKill = `${bytes} of ${of} bytes`;
          killed = server.stop('SIGKILL');
        },
      });
      await killed;
      return `SIGKILL with ${sentAtKill} sent; the upload was ${answer.outcome}`;
    });

    await killAndCheck('Killed as the first of three photos was stored, before the rows', async () => {
      let killed: Promise<void> | undefined;
      let landed = '';
      const watcher = watch(uploadDir, (_event, name) => {
        if (killed || !name || name.endsWith('.part') || storedBefore.has(name)) return;
        landed = name;
        killed = server.stop('SIGKILL');
      });
      const answer = await upload(server.base, url, owner, small.map((data, i) => [`shirt-${i + 1}.jpg`, data] as [string, Buffer]));
      watcher.close();
      await killed;
      return `SIGKILL as ${landed || 'no file'} appeared; the upload was ${answer.outcome}`;
    });

    const after = await upload(server.base, url, owner, [['after.jpg', small[2]!]]);
    const id = after.body?.items?.[0]?.id;
    const [image, thumb] = await Promise.all([owner.get(`/api/photos/${id}/image`), owner.get(`/api/photos/${id}/thumb`)]);
    console.log(`\nAn upload after the kills: ${after.outcome}; its image ${image.status}, its thumbnail ${thumb.status}`);
    checks.push(['an upload after the kills is stored and served', after.status === 201 && image.status === 200 && thumb.status === 200]);
    await checkFolder('after the last upload');
    console.log('');
    verdict(checks);
  } finally {
    await server.stop();
    await knex.destroy();
  }
}

run(main);

import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { Client } from 'pg';
import { addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { databaseUrl } from '../testing/global-setup';
import { tableFingerprints } from '../testing/table-fingerprints';

const ROOT = path.resolve(__dirname, '..', '..');

/** Every file under a folder (its subfolders too, such as the uploads' incoming/), by path, with a hash of its bytes. */
const files = (dir: string, prefix = ''): Record<string, string> =>
  Object.fromEntries(
    readdirSync(dir, { withFileTypes: true })
      .sort((a, b) => a.name.localeCompare(b.name))
      .flatMap((e) => (e.isDirectory() ? Object.entries(files(path.join(dir, e.name), `${prefix}${e.name}/`)) : [[`${prefix}${e.name}`, createHash('sha256').update(readFileSync(path.join(dir, e.name))).digest('hex')]])),
  );

describe('npm run backup and npm run restore', () => {
  let t: TestApp;
  const work = mkdtempSync(path.join(tmpdir(), 'keepstitch-backup-'));
  const restoreUrl = databaseUrl(`ks_restore_${process.pid}`);

  beforeAll(async () => {
    t = await startTestApp();
  });
  afterAll(async () => {
    const admin = new Client({ connectionString: databaseUrl('postgres') });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS ks_restore_${process.pid} WITH (FORCE)`);
    await admin.end();
    await t.close();
    rmSync(work, { recursive: true, force: true });
  });

  it('restores every table and every photo file exactly into a fresh database', async () => {
    const owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    const c = await addUser(t.knex, 'client');
    const commission = await addCommission(t.knex, c.clientId!, { title: 'Backed-up quilt', widthMm: '1536.7' });
    const [g] = await t.knex('garments').insert({ commissionId: commission, description: 'Shirt', features: JSON.stringify([{ kind: 'pocket', position: 'left' }]) }).returning('id');
    await t.knex('custodyEvents').insert({ garmentId: g.id, kind: 'received' });
    const photo = await sharp({ create: { width: 40, height: 30, channels: 3, background: '#884422' } }).jpeg().toBuffer();
    expect((await owner.agent.post(`/api/garments/${g.id}/photos`).set('X-XSRF-TOKEN', owner.csrf).attach('photos', photo, 'p.jpg')).status).toBe(201);

    const env = { ...process.env, DATABASE_URL: t.url, UPLOAD_DIR: t.uploadDir, BACKUP_DIR: path.join(work, 'backups') };
    const archive = execFileSync('bash', ['scripts/backup.sh'], { cwd: ROOT, env, encoding: 'utf8' }).trim().split('\n').pop()!;
    expect(archive).toMatch(/keepstitch-\d{8}T\d{6}Z\.tar\.gz$/);

    const restoredUploads = path.join(work, 'restored-uploads');
    execFileSync('bash', ['scripts/restore.sh', archive], { cwd: ROOT, env: { ...env, DATABASE_URL: restoreUrl, UPLOAD_DIR: restoredUploads }, stdio: 'pipe' });

    const before = await tableFingerprints(t.url);
    const after = await tableFingerprints(restoreUrl);
    expect(Object.keys(before)).toEqual(expect.arrayContaining(['clients', 'commissions', 'custody_events', 'garments', 'photos', 'knex_migrations']));
    expect(after).toEqual(before);
    expect(files(restoredUploads)).toEqual(files(t.uploadDir));
    expect(Object.keys(files(restoredUploads))).toHaveLength(2);
  });

  it('refuses to restore without a backup file', () => {
    expect(() => execFileSync('bash', ['scripts/restore.sh', path.join(work, 'nope.tar.gz')], { cwd: ROOT, env: { ...process.env, DATABASE_URL: restoreUrl }, stdio: 'pipe' })).toThrow(/Usage/);
  });
});

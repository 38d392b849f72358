import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';

describe('studio locale setting', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    client = await signedIn(t.app, (await addUser(t.knex, 'client')).email);
  });
  afterAll(() => t.close());

  it('is British English until the owner picks another', async () => {
    expect((await owner.get('/api/settings')).body.locale).toBe('en-GB');
    expect((await owner.get('/api/settings/locale')).body).toEqual({ locale: 'en-GB' });
  });

  it('keeps a locale the owner picks from the list, and every signed-in role reads it', async () => {
    for (const locale of ['en-US', 'en-IE', 'en-CA', 'ja-JP', 'en-GB', 'en-US']) {
      const res = await owner.patch('/api/settings', { locale });
      expect(res.status).toBe(200);
      expect(res.body.locale).toBe(locale);
    }
    expect((await t.knex('studio_settings').where({ id: 1 }).first()).locale).toBe('en-US');
    for (const who of [owner, workroom, client]) expect((await who.get('/api/settings/locale')).body).toEqual({ locale: 'en-US' });
    expect((await new ApiAgent(t.app).get('/api/settings/locale')).status).toBe(401);
  });

  it('refuses a locale not on the list with a message naming the choices, and changes nothing', async () => {
    await owner.patch('/api/settings', { locale: 'en-GB' });
    for (const locale of ['fr-FR', 'en_GB', 'EN-GB', '', 42, null]) {
      const res = await owner.patch('/api/settings', { locale, studioName: 'Not kept' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.locale).toBe('Pick the studio locale from the list: en-GB, en-US, en-IE, en-CA, ja-JP.');
    }
    const row = await t.knex('studio_settings').where({ id: 1 }).first();
    expect(row).toMatchObject({ locale: 'en-GB' });
    expect(row.studioName).not.toBe('Not kept');
  });

  it('leaves the locale alone when other settings are saved', async () => {
    await owner.patch('/api/settings', { locale: 'ja-JP' });
    expect((await owner.patch('/api/settings', { validityDays: 14 })).body.locale).toBe('ja-JP');
  });

  it('lets only the owner change it', async () => {
    expect((await workroom.patch('/api/settings', { locale: 'en-US' })).status).toBe(403);
    expect((await t.knex('studio_settings').where({ id: 1 }).first()).locale).toBe('ja-JP');
  });

  it('is held to the list by the database too', async () => {
    await expect(t.knex('studio_settings').where({ id: 1 }).update({ locale: 'xx-XX' })).rejects.toThrow(/studio_settings_locale_check/);
  });
});

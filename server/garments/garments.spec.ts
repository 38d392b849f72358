import { CUSTODY_TEXT_LIMITS, KEPT_FEATURE_LIMITS } from '@keepstitch/shared';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';

describe('garments, custody and panels', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let clientA: ApiAgent;
  let clientB: ApiAgent;
  let commissionA: number;
  let commissionB: number;

  beforeAll(async () => {
    t = await startTestApp();
    owner = await signedIn(t.app, (await addUser(t.knex, 'owner')).email);
    workroom = await signedIn(t.app, (await addUser(t.knex, 'workroom')).email);
    const a = await addUser(t.knex, 'client');
    const b = await addUser(t.knex, 'client');
    clientA = await signedIn(t.app, a.email);
    clientB = await signedIn(t.app, b.email);
    commissionA = await addCommission(t.knex, a.clientId!, { ageGroup: 'child_under_3' });
    commissionB = await addCommission(t.knex, b.clientId!);
  });
  afterAll(() => t.close());

  it('lets a client announce a garment on its own commission with its story', async () => {
    const res = await clientA.post(`/api/commissions/${commissionA}/garments`, {
      description: 'Checked flannel shirt',
      whose: 'Grandad',
      story: 'The shirt he wore every Sunday.',
      fibre: 'flannel',
    });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ description: 'Checked flannel shirt', status: 'expected' });
    const events = await t.knex('custodyEvents').where('garmentId', res.body.id);
    expect(events.map((e) => e.kind)).toEqual(['announced']);
  });

  it('does not let a client set studio fields or add to another client\u2019s commission', async () => {
    const studioField = await clientA.post(`/api/commissions/${commissionA}/garments`, { description: 'Dress', condition: 'Torn' });
    expect(studioField.status).toBe(400);
    expect(studioField.body.error.fields.condition).toBe('This field is not accepted here.');
    const other = await clientA.post(`/api/commissions/${commissionB}/garments`, { description: 'Sneaky' });
    expect(other.status).toBe(404);
    expect(await t.knex('garments').where('description', 'Sneaky')).toHaveLength(0);
  });

  it('derives place and state from custody events and keeps a full log', async () => {
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, {
      description: 'Denim jacket',
      fibre: 'denim',
      features: [{ kind: 'buttons', position: 'front' }, { kind: 'pocket', position: 'left chest' }],
    })).body;
    const event = (body: object) => workroom.post(`/api/garments/${g.id}/events`, body);
    expect((await event({ kind: 'cut' })).status).toBe(409);
    expect((await event({ kind: 'received' })).body.state).toMatchObject({ status: 'in_studio', received: true });
    expect((await event({ kind: 'stored' })).body.error.fields.place).toBe('Say where it is stored (box or shelf).');
    const stored = await event({ kind: 'stored', place: 'Box 4' });
    expect(stored.body.state.place).toBe('Box 4');
    const moved = await event({ kind: 'moved', place: 'Shelf C' });
    expect((await event({ kind: 'correction', correctsEventId: moved.body.event.id, note: 'Never moved' })).status).toBe(201);
    const detail = await owner.get(`/api/garments/${g.id}`);
    expect(detail.body.place).toBe('Box 4');
    expect(detail.body.events.map((e: { kind: string }) => e.kind)).toEqual(['announced', 'received', 'stored', 'moved', 'correction']);
    // A piece for a child under 3: kept buttons are flagged for removal.
    expect(detail.body.removeForSafety).toEqual([{ kind: 'buttons', position: 'front' }]);
    expect((await event({ kind: 'returned', returnMethod: 'post' })).body.error.fields.trackingRef).toBe('Give the tracking reference for a garment sent by post.');
    expect((await event({ kind: 'returned', returnMethod: 'post', trackingRef: 'TT123' })).body.state.status).toBe('returned');
  });

  it('keeps a kept feature\'s position up to the limit the forms share, and refuses one longer', async () => {
    // KEPT_FEATURE_LIMITS.position in shared/: the intake stepper and the details form hold the same 200 characters.
    expect(KEPT_FEATURE_LIMITS.position).toBe(200);
    const at = 'x'.repeat(KEPT_FEATURE_LIMITS.position);
    const ok = await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Long-noted shirt', features: [{ kind: 'pocket', position: at }] });
    expect(ok.status).toBe(201);
    expect(ok.body.features).toEqual([{ kind: 'pocket', position: at }]);
    const over = await workroom.patch(`/api/garments/${ok.body.id}`, { features: [{ kind: 'pocket', position: `${at}x` }] });
    expect(over.status).toBe(400);
    expect(over.body.error.fields['features.0.position']).toBe('A position can be at most 200 characters.');
  });

  it('keeps a storage place up to the limit the form shares, and refuses a longer one with a message', async () => {
    // CUSTODY_TEXT_LIMITS in shared/: the garment page's entry form holds the same 60 characters as the column.
    expect(CUSTODY_TEXT_LIMITS.place).toBe(60);
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Long-shelved scarf' })).body;
    const event = (body: object) => workroom.post(`/api/garments/${g.id}/events`, body);
    expect((await event({ kind: 'received' })).status).toBe(201);
    const over = await event({ kind: 'stored', place: 'p'.repeat(61) });
    expect(over.status).toBe(400);
    expect(over.body.error.fields.place).toBe('A place can be at most 60 characters.');
    const ok = await event({ kind: 'stored', place: 'p'.repeat(60) });
    expect(ok.status).toBe(201);
    expect(ok.body.state.place).toBe('p'.repeat(60));
  });

  it('lets the studio mark a fibre as not known', async () => {
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Mystery blouse', fibre: 'silk' })).body;
    const res = await workroom.patch(`/api/garments/${g.id}`, { fibre: null });
    expect(res.status).toBe(200);
    expect(res.body.fibre).toBeNull();
  });

  it('keeps custody events append-only in the database itself', async () => {
    const [g] = await t.knex('garments').insert({ commissionId: commissionA, description: 'Scarf' }).returning('id');
    const [e] = await t.knex('custodyEvents').insert({ garmentId: g.id, kind: 'received' }).returning('id');
    await expect(t.knex('custodyEvents').where('id', e.id).update({ kind: 'cut' })).rejects.toThrow(/append-only/);
    await expect(t.knex('custodyEvents').where('id', e.id).delete()).rejects.toThrow(/append-only/);
    await expect(t.knex('garments').where('id', g.id).delete()).rejects.toThrow();
  });

  it('hides storage places and studio notes from the client', async () => {
    const g = (await clientA.post(`/api/commissions/${commissionA}/garments`, { description: 'Wool jumper' })).body;
    await owner.post(`/api/garments/${g.id}/events`, { kind: 'received' });
    await owner.post(`/api/garments/${g.id}/events`, { kind: 'stored', place: 'Box 7' });
    const seen = await clientA.get(`/api/garments/${g.id}`);
    expect(seen.body.status).toBe('in_studio');
    expect(seen.body.place).toBeUndefined();
    expect(JSON.stringify(seen.body)).not.toContain('Box 7');
    expect((await clientB.get(`/api/garments/${g.id}`)).status).toBe(404);
    expect((await clientA.post(`/api/garments/${g.id}/events`, { kind: 'cut' })).status).toBe(403);
  });

  it('records usable panels typed as fractions or metric, exactly', async () => {
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Linen shirt', fibre: 'linen' })).body;
    const back = await workroom.post(`/api/garments/${g.id}/panels`, { name: 'back', width: '19 1/2', height: '26', unit: 'in' });
    expect(back.status).toBe(201);
    // 19 1/2 in x 25.4 = 495.3 mm exactly (1 in = 25.4 mm, NIST SP 811 appendix B).
    expect(back.body).toMatchObject({ name: 'back', widthMm: '495.3', heightMm: '660.4', grain: 'vertical' });
    const sleeve = await workroom.post(`/api/garments/${g.id}/panels`, { name: 'sleeve', width: '21.5 cm', height: '55', unit: 'cm', grain: 'horizontal' });
    expect(sleeve.body).toMatchObject({ widthMm: '215', heightMm: '550' });
    const bad = await workroom.post(`/api/garments/${g.id}/panels`, { name: '', width: '1/0', height: '-3' });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['height', 'name', 'width']);
    const patched = await workroom.patch(`/api/panels/${back.body.id}`, { width: '7½' });
    expect(patched.body.widthMm).toBe('190.5');
    expect((await workroom.delete(`/api/panels/${sleeve.body.id}`)).status).toBe(204);
    const detail = await owner.get(`/api/garments/${g.id}`);
    expect(detail.body.panels.map((p: { name: string }) => p.name)).toEqual(['back']);
    expect((await clientA.get(`/api/garments/${g.id}`)).body.panels).toBeUndefined();
  });

  it('keeps a panel\'s kept features exactly, typed as lengths in the panel\'s unit', async () => {
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Green flannel shirt', fibre: 'flannel' })).body;
    const front = await workroom.post(`/api/garments/${g.id}/panels`, {
      name: 'left front',
      width: '10',
      height: '23 1/2',
      unit: 'in',
      features: [{ name: 'breast pocket', x: '2', y: '4', width: '5', height: '5½' }],
    });
    expect(front.status).toBe(201);
    // 2 in, 4 in, 5 in and 5 1/2 in at 25.4 mm to the inch (NIST SP 811 appendix B): 50.8, 101.6, 127, 139.7.
    const pocket = { name: 'breast pocket', xMm: '50.8', yMm: '101.6', widthMm: '127', heightMm: '139.7' };
    expect(front.body.features).toEqual([pocket]);
    const detail = await owner.get(`/api/garments/${g.id}`);
    expect(detail.body.panels.find((p: { id: number }) => p.id === front.body.id).features).toEqual([pocket]);
    const commission = await owner.get(`/api/commissions/${commissionA}`);
    const listed = commission.body.garments.find((x: { id: number }) => x.id === g.id);
    expect(listed.panels[0].features).toEqual([pocket]);

    // Metric, with a feature on the panel's edge (x 0) and a second one added by PATCH.
    const label = { name: 'maker\'s label', x: '0', y: '1.5 cm', width: '45mm', height: '2' };
    const patched = await workroom.patch(`/api/panels/${front.body.id}`, { features: [{ name: 'breast pocket', x: '5.08', y: '10.16', width: '12.7', height: '13.97' }, label], unit: 'cm' });
    expect(patched.status).toBe(200);
    expect(patched.body.features).toEqual([pocket, { name: 'maker\'s label', xMm: '0', yMm: '15', widthMm: '45', heightMm: '20' }]);
    expect(patched.body.widthMm).toBe('254');

    // A panel without features lists none.
    const back = await workroom.post(`/api/garments/${g.id}/panels`, { name: 'back', width: '21', height: '26 1/2' });
    expect(back.body.features).toEqual([]);
  });

  it('refuses a kept feature outside its panel with a message on the field to correct', async () => {
    const g = (await owner.post(`/api/commissions/${commissionA}/garments`, { description: 'Corduroy jacket', fibre: 'cotton' })).body;
    const wide = await workroom.post(`/api/garments/${g.id}/panels`, {
      name: 'left front',
      width: '10',
      height: '20',
      features: [{ name: 'breast pocket', x: '6', y: '4', width: '5', height: '5' }],
    });
    expect(wide.status).toBe(400);
    expect(Object.keys(wide.body.error.fields)).toEqual(['features.0.width']);
    expect(wide.body.error.fields['features.0.width']).toBe(
      "The breast pocket runs past the panel's right edge: it ends 11 in (27.9 cm) from the left, and the panel is 10 in (25.4 cm) wide.",
    );
    const bad = await workroom.post(`/api/garments/${g.id}/panels`, {
      name: 'left front',
      width: '10',
      height: '20',
      features: [{ name: '', x: '-1', y: 'abc', width: '0', height: '3', colour: 'red' }],
    });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['features.0.colour', 'features.0.name', 'features.0.width', 'features.0.x', 'features.0.y']);
    expect(await t.knex('panels').where('garmentId', g.id)).toHaveLength(0);

    const panel = (await workroom.post(`/api/garments/${g.id}/panels`, { name: 'left front', width: '10', height: '20', features: [{ name: 'pocket', x: '2', y: '4', width: '5', height: '5' }] })).body;
    const tall = await workroom.patch(`/api/panels/${panel.id}`, { features: [{ name: 'pocket', x: '2', y: '16', width: '5', height: '5' }] });
    expect(tall.status).toBe(400);
    expect(tall.body.error.fields['features.0.height']).toMatch(/runs past the panel's bottom edge: it ends 21 in .* from the top, and the panel is 20 in .* high\./);
    // Making the panel too narrow for the feature it holds is refused on the width.
    const narrow = await workroom.patch(`/api/panels/${panel.id}`, { width: '6' });
    expect(narrow.status).toBe(400);
    expect(narrow.body.error.fields.width).toMatch(/^The pocket runs past the panel's right edge/);
    const stored = await t.knex('panels').where('id', panel.id).first();
    expect(stored.widthMm).toBe('254');
    expect(stored.features).toEqual([{ name: 'pocket', xMm: '50.8', yMm: '101.6', widthMm: '127', heightMm: '127' }]);
    // Removing every feature is a change like any other.
    expect((await workroom.patch(`/api/panels/${panel.id}`, { features: [] })).body.features).toEqual([]);
  });

  it('lists garments with their state on the commission page and counts them for the stage rules', async () => {
    const detail = await owner.get(`/api/commissions/${commissionA}`);
    expect(detail.body.garments.length).toBeGreaterThanOrEqual(4);
    expect(detail.body.facts.garmentCount).toBe(detail.body.garments.filter((g: { status: string }) => g.status !== 'withdrawn').length);
  });
});

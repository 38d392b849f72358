import Decimal from 'decimal.js';
import { deriveDesign, garmentColour, meanColour, planDesign, type DesignBody, type DesignSources } from '@keepstitch/shared';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../testing/test-app';
import { addCommission } from '../testing/fixtures';
import { readPdf } from '../testing/pdf-reader';
import { POCKET as pocket, squaresDesign } from '../../shared/src/testing/design-fixtures';

const inch = (n: number) => new Decimal(n).times('25.4').toString();
const inches = (mm: string) => new Decimal(mm).dividedBy('25.4').toNumber();

describe('designs', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let workroom: ApiAgent;
  let client: ApiAgent;
  let otherClient: ApiAgent;
  let commissionId: number;
  let otherCommissionId: number;
  let blue: number;
  let green: number;
  let strangerGarment: number;
  let navy: number;

  function body(over: Partial<DesignBody> = {}): DesignBody {
    return {
      units: 'imperial',
      target: { preset: null, dropMm: null, widthMm: inch(40), lengthMm: inch(40) },
      layout: { setting: 'straight', rows: 2, columns: 2, blockMm: inch(12), sashing: { widthMm: inch(2), cornerstones: true }, borders: [inch(4)] },
      blocks: [
        { id: 'A', name: 'Shirt plate', kind: 'plate', blades: 20, outerRadiusMm: inch(5), innerRadiusMm: inch(1.5) },
        { id: 'B', name: 'Shirt square', kind: 'square' },
      ],
      pattern: ['A', 'B', 'B', 'A'],
      assignments: [
        { target: { kind: 'position', index: 1 }, fabric: { kind: 'garment', garmentId: blue } },
        { target: { kind: 'position', index: 2 }, fabric: { kind: 'garment', garmentId: green } },
        { target: { kind: 'piece', key: 'block:A:background' }, fabric: { kind: 'stock', stockId: navy } },
        { target: { kind: 'piece', key: 'block:A:centre' }, fabric: { kind: 'stock', stockId: navy } },
        { target: { kind: 'piece', key: 'sashing' }, fabric: { kind: 'stock', stockId: navy } },
        { target: { kind: 'piece', key: 'cornerstones' }, fabric: { kind: 'stock', stockId: navy } },
        { target: { kind: 'piece', key: 'border:1' }, fabric: { kind: 'stock', stockId: navy } },
      ],
      finishing: { bindingStockId: navy, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: true, shrinkPercent: '3' },
      rules: { minimumPerGarment: 1 },
      ...over,
    };
  }

  beforeAll(async () => {
    t = await startTestApp();
    const o = await addUser(t.knex, 'owner');
    const w = await addUser(t.knex, 'workroom');
    const c = await addUser(t.knex, 'client');
    const c2 = await addUser(t.knex, 'client');
    owner = await signedIn(t.app, o.email);
    workroom = await signedIn(t.app, w.email);
    client = await signedIn(t.app, c.email);
    otherClient = await signedIn(t.app, c2.email);
    commissionId = await addCommission(t.knex, c.clientId!, { title: 'Shirt quilt', ageGroup: 'baby_under_1' });
    otherCommissionId = await addCommission(t.knex, c2.clientId!, { title: 'Other quilt' });
    const garment = async (commission: number, description: string, colour: string, fibre: string, panels: [string, number, number][]) => {
      const [g] = await t.knex('garments').insert({ commissionId: commission, description, colour, fibre, features: '[]' }).returning('id');
      await t.knex('panels').insert(panels.map(([name, w2, h]) => ({ garmentId: g.id, name, widthMm: inch(w2), heightMm: inch(h), grain: 'vertical' })));
      return g.id as number;
    };
    blue = await garment(commissionId, 'Blue shirt', 'Pale blue', 'cotton', [['back', 22, 27], ['sleeve', 9, 22]]);
    green = await garment(commissionId, 'Green flannel shirt', 'Green', 'flannel', [['back', 21, 26]]);
    strangerGarment = await garment(otherCommissionId, 'Someone else\u2019s shirt', 'Red', 'cotton', [['back', 20, 20]]);
    const [s] = await t.knex('stockFabrics').insert({ name: 'Navy cotton', colour: 'Navy', fibre: 'cotton', widthMm: inch(42), lengthMm: inch(36), costPence: 1200, costUnit: 'metre' }).returning('id');
    navy = s.id;
  });
  afterAll(() => t.close());

  it('derives the pieces, plans them and stores the plan with version 1', async () => {
    const res = await owner.post(`/api/commissions/${commissionId}/design`, { body: body(), note: 'First go' });
    expect(res.status).toBe(201);
    expect(res.body.version).toBe(1);
    const pieces = res.body.derived.pieces as { key: string; count: number; widthMm: string }[];
    const count = (key: string) => pieces.filter((p) => p.key === key).reduce((n, p) => n + p.count, 0);
    // Hand-worked: 2 plates x 20 blades / 2 = 20 blade pairs; 2 squares cut 12 1/2 in; sashing 1 x 2 + 2 x 1 = 4 strips; 1 cornerstone.
    expect(count('block:A:blades')).toBe(20);
    expect(count('block:B:square')).toBe(2);
    expect(inches(pieces.find((p) => p.key === 'block:B:square')!.widthMm)).toBe(12.5);
    expect(count('sashing')).toBe(4);
    expect(count('cornerstones')).toBe(1);
    // Hand-worked: 2 x 12 + 2 + 2 x 4 = 34 in square; 6 in short of the 40 in target each way.
    expect(inches(res.body.derived.finished.widthMm)).toBe(34);
    expect(inches(res.body.derived.difference.lengthMm)).toBe(-6);

    const row = await t.knex('designVersions').where({ commissionId, version: 1 }).first();
    expect(row.plan.plan.placements.length).toBe(row.plan.totals.piecesPlaced);
    expect(row.plan.totals.piecesRequested).toBe(row.derived.totals.pieces);
    // Each garment is used, and the squares come from the garment assigned to their position.
    const placements = row.plan.plan.placements as { pieceId: string; garmentId?: string }[];
    const square = (garmentId: number) => row.derived.pieces.find((p: { key: string; fabric: { garmentId?: number } | null }) => p.key === 'block:B:square' && p.fabric?.garmentId === garmentId).id;
    expect(placements.find((p) => p.pieceId === square(blue))!.garmentId).toBe(String(blue));
    expect(placements.find((p) => p.pieceId === square(green))!.garmentId).toBe(String(green));
    expect(row.plan.shopping.find((s: { stockId: number }) => s.stockId === navy)).toBeDefined();
  });

  it('keeps earlier versions when the design is edited', async () => {
    const res = await owner.post(`/api/commissions/${commissionId}/design`, { body: body({ layout: { ...body().layout, borders: [inch(3)] } }) });
    expect(res.status).toBe(201);
    expect(res.body.version).toBe(2);
    const current = await owner.get(`/api/commissions/${commissionId}/design`);
    expect(current.body.current.version).toBe(2);
    expect(current.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const first = await owner.get(`/api/commissions/${commissionId}/design/versions/1`);
    expect(first.body.body.layout.borders).toEqual([inch(4)]);
    expect(first.body.note).toBe('First go');
  });

  it('previews a re-plan without saving', async () => {
    const res = await owner.post(`/api/commissions/${commissionId}/design/preview`, body({ layout: { ...body().layout, rows: 3 } }));
    expect(res.status).toBe(200);
    expect(res.body.derived.positions).toHaveLength(6);
    expect((await t.knex('designVersions').where({ commissionId })).length).toBe(2);
  });

  it('refuses a plate too large for its block, and a garment of another commission', async () => {
    const big = await owner.post(`/api/commissions/${commissionId}/design/preview`, body({ blocks: [{ id: 'A', name: 'Big', kind: 'plate', blades: 20, outerRadiusMm: inch(6), innerRadiusMm: inch(2) }, { id: 'B', name: 'Sq', kind: 'square' }] }));
    expect(big.status).toBe(400);
    expect(big.body.error.code).toBe('design_invalid');
    const stranger = await owner.post(`/api/commissions/${commissionId}/design`, { body: body({ assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'garment', garmentId: strangerGarment } }] }) });
    expect(stranger.status).toBe(400);
    expect(stranger.body.error.fields['assignments.0.fabric']).toMatch(/not part of this commission/);
  });

  it('shows the workroom the design and printouts without any price', async () => {
    const res = await workroom.get(`/api/commissions/${commissionId}/design`);
    expect(res.status).toBe(200);
    expect(JSON.stringify(res.body)).not.toMatch(/pence|cost|price|budget/i);
    expect((await workroom.post(`/api/commissions/${commissionId}/design`, { body: body() })).status).toBe(403);
    const pdf = await workroom.get(`/api/commissions/${commissionId}/design/cut-list.pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
  });

  it('lets a client see only a shared drawing of its own commission, and answer it', async () => {
    expect((await client.get(`/api/commissions/${commissionId}/design`)).status).toBe(403);
    expect((await client.get(`/api/commissions/${commissionId}/design/shared`)).status).toBe(404);
    expect((await owner.post(`/api/commissions/${commissionId}/design/share`, {})).status).toBe(200);
    const shared = await client.get(`/api/commissions/${commissionId}/design/shared`);
    expect(shared.status).toBe(200);
    expect(shared.body.version).toBe(2);
    expect(shared.body.plan).toBeUndefined();
    expect(shared.body.derived.pieces).toBeUndefined();
    expect(shared.body.derived.positions).toHaveLength(4);
    expect((await otherClient.get(`/api/commissions/${commissionId}/design/shared`)).status).toBe(404);
    expect((await otherClient.post(`/api/commissions/${commissionId}/design/response`, { response: 'approved' })).status).toBe(404);

    const noNote = await client.post(`/api/commissions/${commissionId}/design/response`, { response: 'changes_requested' });
    expect(noNote.status).toBe(400);
    const asked = await client.post(`/api/commissions/${commissionId}/design/response`, { response: 'changes_requested', note: 'Could the green shirt go in the middle?' });
    expect(asked.status).toBe(200);
    const seen = await owner.get(`/api/commissions/${commissionId}/design`);
    expect(seen.body.current.clientResponse).toBe('changes_requested');
    expect(seen.body.current.clientNote).toBe('Could the green shirt go in the middle?');
  });

  describe('printouts', () => {
    it('prints the cut list by source with the commission, version, sizes and a cut sequence', async () => {
      const res = await owner.get(`/api/commissions/${commissionId}/design/cut-list.pdf`);
      const { text, pages } = readPdf(res.body as Buffer);
      expect(text).toContain('Cut list');
      expect(text).toContain('Shirt quilt, design version 2');
      expect(text).toContain('From the Blue shirt (Pale blue)');
      expect(text).toContain('From the studio fabric: Navy cotton');
      // The square assigned to the blue shirt: 1 x square 12 1/2 in.
      expect(text).toMatch(/1 x square 12 1\/2 in \(Block B \(Shirt square\): square\)/);
      expect(text).toMatch(/1\. Cut the panel (across|down) at/);
      // A diagram: the panel outline drawn as a rectangle.
      expect(pages[0]!.paths.some((p) => p.paint.includes('fill') || p.paint.includes('Fill'))).toBe(true);
    });

    it('prints the sewing order with the plate counts', async () => {
      const res = await owner.get(`/api/commissions/${commissionId}/design/sewing-order.pdf`);
      const { text } = readPdf(res.body as Buffer);
      // Hand-worked: a 20-blade plate is 10 pairs, then 5 sets of four, then one ring.
      expect(text).toContain('Sew the blades into 10 pairs');
      expect(text).toContain('Join the pairs into 5 sets of four');
      expect(text).toContain('Join the sets into one ring');
    });

    it.each([
      ['a4', 595.28, 841.89],
      ['letter', 612, 792],
    ])('prints templates full size on %s, with a 72 pt inch square and a 2.5 cm square', async (paper, w, h) => {
      const res = await owner.get(`/api/commissions/${commissionId}/design/templates.pdf?paper=${paper}`);
      expect(res.status).toBe(200);
      const { pages, text } = readPdf(res.body as Buffer);
      expect(pages[0]!.width).toBeCloseTo(w, 2);
      expect(pages[0]!.height).toBeCloseTo(h, 2);
      const squares = pages[0]!.paths.filter((p) => Math.abs(p.width - p.height) < 0.001);
      // Published: 1 in = 72 pt (PDF user space) and 1 in = 25.4 mm, so 2.5 cm = 70.866 pt.
      expect(squares.some((p) => Math.abs(p.width - 72) < 0.001)).toBe(true);
      expect(squares.some((p) => Math.abs(p.width - (25 * 72) / 25.4) < 0.001)).toBe(true);
      expect(text).toContain('Block A blade (20 of 360 degrees)');
      expect(text).toContain('1 in check square');
      // The blade's cut line at 1:1: its width is the cut top, 2R sin h + 2s tan h + 2s / cos h (wedge maths, derived)
      // for R = 5 in, r = 1.5 in, h = 9 degrees, s = 1/4 in, in points.
      const hRad = (9 * Math.PI) / 180;
      const cutTop = 2 * 5 * Math.cos(hRad) * Math.tan(hRad) + 0.25 * 2 * Math.tan(hRad) + (2 * 0.25) / Math.cos(hRad);
      expect(pages[0]!.paths.some((p) => Math.abs(p.width - cutTop * 72) < 0.01)).toBe(true);
      expect(text).toContain('Block A centre circle');
    });

    it('tiles a template larger than the page across pages with overlap marks', async () => {
      await owner.post(`/api/commissions/${commissionId}/design`, {
        body: body({ layout: { ...body().layout, blockMm: inch(40), sashing: null, borders: [], rows: 1, columns: 1 }, blocks: [{ id: 'A', name: 'Huge fan', kind: 'fan', blades: 4, outerRadiusMm: inch(36), innerRadiusMm: inch(8) }], pattern: ['A'], assignments: [] }),
      });
      const res = await owner.get(`/api/commissions/${commissionId}/design/templates.pdf?paper=letter`);
      const { pages, text } = readPdf(res.body as Buffer);
      expect(pages.length).toBeGreaterThan(2);
      expect(text).toMatch(/tile 1 of \d+ \(row 1, column 1\)/);
      expect(text).toContain('Tiles overlap by 1/2 in');
      for (const page of pages) expect(page.paths.some((p) => Math.abs(p.width - 72) < 0.001 && Math.abs(p.height - 72) < 0.001)).toBe(true);
    });

    it('prints the care card with fibres, the maker and the baby notice, for the client too', async () => {
      const res = await client.get(`/api/commissions/${commissionId}/care-card.pdf`);
      expect(res.status).toBe(200);
      // The fibre's name is bold, so the PDF holds it as a text run of its own: compare words, not spacing.
      const text = readPdf(res.body as Buffer).text.replace(/\s+/g, ' ');
      expect(text).toContain('colour-catcher');
      // One line per fibre: the studio's navy cotton joins the client's cotton shirt.
      expect(text).toContain('Cotton: Blue shirt; Navy cotton (studio fabric)');
      expect(text).toContain('Flannel: Green flannel shirt');
      expect((await client.get(`/api/commissions/${commissionId}/care-card`)).body.fibres).toEqual([
        { fibre: 'cotton', garments: ['Blue shirt'], studio: ['Navy cotton'] },
        { fibre: 'flannel', garments: ['Green flannel shirt'], studio: [] },
      ]);
      expect(text).toMatch(/Made by owner \d+/);
      expect(text).toContain('Safe sleep for babies under 12 months');
      expect(text).toContain('follow their advice');
      expect((await otherClient.get(`/api/commissions/${commissionId}/care-card.pdf`)).status).toBe(404);
    });
  });

  describe('groups of garments and kept features', () => {
    let pocketCommission: number;
    let shirt: number;
    let polo: number;
    let flannel: number;
    const blueHex = garmentColour({ colour: 'Pale blue', description: 'Blue oxford shirt' });
    const navyHex = garmentColour({ colour: 'Navy', description: 'Navy knit polo' });

    /** Two rows of two 8 in plain squares; block 1 is given "The blues", and a second group is given nothing. */
    function squares(over: Partial<DesignBody> = {}): DesignBody {
      return squaresDesign(8, 2, 2, {
        groups: [
          { id: 'g1', name: '  The blues ', garmentIds: [shirt, polo] },
          { id: 'g2', name: 'Still to come', garmentIds: [] },
        ],
        assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'group', groupId: 'g1' } }],
        ...over,
      });
    }

    beforeAll(async () => {
      const c = await addUser(t.knex, 'client');
      pocketCommission = await addCommission(t.knex, c.clientId!, { title: 'Pocket quilt' });
      const garment = async (description: string, colour: string, panels: [string, number, number, object[]][]) => {
        const [g] = await t.knex('garments').insert({ commissionId: pocketCommission, description, colour, fibre: 'cotton', features: '[]' }).returning('id');
        await t.knex('panels').insert(panels.map(([name, w, h, features]) => ({ garmentId: g.id, name, widthMm: inch(w), heightMm: inch(h), grain: 'vertical', features: JSON.stringify(features) })));
        return g.id as number;
      };
      shirt = await garment('Blue oxford shirt', 'Pale blue', [['back', 22, 27, []]]);
      polo = await garment('Navy knit polo', 'Navy', [['back', 19.5, 25, []]]);
      flannel = await garment('Green flannel shirt', 'Green', [['left front', 12, 24, [pocket]]]);
    });

    it('saves a group given to nothing, and one with no garments yet, and reads both back', async () => {
      const res = await owner.post(`/api/commissions/${pocketCommission}/design`, { body: squares() });
      expect(res.status).toBe(201);
      const groups = [
        { id: 'g1', name: 'The blues', garmentIds: [shirt, polo] },
        { id: 'g2', name: 'Still to come', garmentIds: [] },
      ];
      expect(res.body.body.groups).toEqual(groups);
      const screen = await owner.get(`/api/commissions/${pocketCommission}/design`);
      expect(screen.body.current.body.groups).toEqual(groups);
      expect((await owner.get(`/api/commissions/${pocketCommission}/design/versions/1`)).body.body.groups).toEqual(groups);
      // The legend draws a group in stripes of its garments' colours, as the app does, not in its first garment's colour.
      const legend = (key: string) => screen.body.fabrics.find((f: { key: string }) => f.key === key);
      expect(legend('group:g1')).toEqual({ key: 'group:g1', kind: 'group', id: null, name: 'The blues', colour: null, hex: meanColour([blueHex, navyHex]), stripes: [blueHex, navyHex], detail: 'any of 2 garments' });
      expect(legend('group:g1').hex).not.toBe(blueHex);
      expect(legend('group:g2')).toMatchObject({ name: 'Still to come', stripes: [], detail: 'any of 0 garments' });
    });

    it('refuses groups sharing an id or a name, a name too long, a garment of another commission, and a group no list holds', async () => {
      const twice = await owner.post(`/api/commissions/${pocketCommission}/design/preview`, squares({ groups: [{ id: 'g1', name: 'The blues', garmentIds: [shirt] }, { id: 'g1', name: 'THE BLUES', garmentIds: [polo] }] }));
      expect(twice.status).toBe(400);
      expect(twice.body.error.fields).toEqual({ 'groups.1.id': 'Another group has this id.', 'groups.1.name': 'Another group has this name.' });
      const long = await owner.post(`/api/commissions/${pocketCommission}/design/preview`, squares({ groups: [{ id: 'g1', name: 'x'.repeat(101), garmentIds: [shirt] }] }));
      expect(long.body.error.fields).toEqual({ 'groups.0.name': 'A group name can be at most 100 characters.' });
      const blank = await owner.post(`/api/commissions/${pocketCommission}/design/preview`, squares({ groups: [{ id: 'G 1', name: '   ', garmentIds: [shirt, shirt] }] }));
      expect(blank.body.error.fields).toMatchObject({ 'groups.0.id': expect.stringMatching(/lower-case/), 'groups.0.name': 'Name the group.' });
      const unlisted = await owner.post(`/api/commissions/${pocketCommission}/design`, { body: squares({ groups: undefined }) });
      expect(unlisted.status).toBe(400);
      expect(unlisted.body.error.fields).toEqual({ 'body.assignments.0.fabric.groupId': 'The design has no group with this id.' });
      const stranger = await owner.post(`/api/commissions/${pocketCommission}/design/preview`, squares({ groups: [{ id: 'g1', name: 'Mixed', garmentIds: [shirt, strangerGarment] }] }));
      expect(stranger.status).toBe(400);
      expect(stranger.body.error.fields).toEqual({ 'groups.0.garmentIds': 'A garment of the group is not part of this commission.' });
      // An older body still naming a group in full is not accepted from the app.
      const inline = await owner.post(`/api/commissions/${pocketCommission}/design/preview`, squares({ assignments: [{ target: { kind: 'position', index: 0 }, fabric: { kind: 'group', name: 'The blues', garmentIds: [shirt, polo] } as never }] }));
      expect(inline.status).toBe(400);
    });

    it('reads a version saved before groups were listed, naming its groups by id in the body and the derivation', async () => {
      const listed = squares({ groups: [{ id: 'g1', name: 'The blues', garmentIds: [shirt, polo] }] });
      const derived = deriveDesign(listed);
      const sources: DesignSources = { garments: [], stock: [] };
      // As an older version stored it: no list, and the group written out wherever it was given.
      const written = JSON.stringify({ kind: 'group', name: 'The blues', garmentIds: [shirt, polo] });
      const older = (x: unknown) => JSON.parse(JSON.stringify(x).replaceAll('{"kind":"group","groupId":"g1"}', written));
      const { groups: _, ...withoutList } = listed;
      const oldBody = older(withoutList);
      expect(JSON.stringify(oldBody)).not.toContain('groupId');
      await t.knex('designVersions').insert({ commissionId: pocketCommission, version: 2, body: JSON.stringify(oldBody), derived: JSON.stringify(older(derived)), plan: JSON.stringify(planDesign(listed, derived, sources)), note: 'Older' });
      const screen = await owner.get(`/api/commissions/${pocketCommission}/design`);
      expect(screen.body.current.version).toBe(2);
      expect(screen.body.current.body.groups).toEqual([{ id: 'g1', name: 'The blues', garmentIds: [shirt, polo] }]);
      expect(screen.body.current.body.assignments[0].fabric).toEqual({ kind: 'group', groupId: 'g1' });
      expect(screen.body.current.derived.positions[0].fabrics.square).toEqual({ kind: 'group', groupId: 'g1' });
      expect(screen.body.fabrics.find((f: { key: string }) => f.key === 'group:g1').stripes).toEqual([blueHex, navyHex]);
      expect((await owner.get(`/api/commissions/${pocketCommission}/design/cut-list.pdf`)).status).toBe(200);
      // Saved again as it was read, it is a valid design.
      const resaved = await owner.post(`/api/commissions/${pocketCommission}/design`, { body: screen.body.current.body });
      expect(resaved.status).toBe(201);
    });

    it('says which block keeps the pocket, to the owner and the client, and prints it in the cut list with the group in stripes', async () => {
      const saved = await owner.post(`/api/commissions/${pocketCommission}/design`, { body: squares() });
      expect(saved.status).toBe(201);
      // The pocket is on the green flannel, which only the planner's choice may give (blocks 2 to 4): the last of those, block 4.
      expect(saved.body.plan.keptFeatures).toEqual([expect.objectContaining({ feature: 'breast pocket', garmentId: flannel, garment: 'Green flannel shirt', panel: 'left front', copy: 3 })]);
      expect((await owner.post(`/api/commissions/${pocketCommission}/design/share`, {})).status).toBe(200);
      const c = await t.knex('commissions').where({ id: pocketCommission }).first();
      const clientUser = await t.knex('users').where({ clientId: c.clientId }).first();
      const itsClient = await signedIn(t.app, clientUser.email);
      const shared = await itsClient.get(`/api/commissions/${pocketCommission}/design/shared`);
      expect(shared.body.keptFeatures).toEqual([{ position: 3, rail: null, feature: 'breast pocket', garment: 'Green flannel shirt' }]);
      expect(shared.body.fabrics.find((f: { key: string }) => f.key === 'group:g1').stripes).toEqual([blueHex, navyHex]);

      const pdf = await owner.get(`/api/commissions/${pocketCommission}/design/cut-list.pdf`);
      const { text, pages } = readPdf(pdf.body as Buffer);
      const flat = text.replace(/\s+/g, ' ');
      expect(flat).toContain('Kept feature: 1 of these keeps the breast pocket from the Green flannel shirt, centred, for block 4; cut with the feature centred.');
      expect(flat).toMatch(/which keeps the breast pocket from the Green flannel shirt, centred, for block 4; cut with the feature centred/);
      expect(flat).toContain('Block 4 keeps the breast pocket from the Green flannel shirt');
      expect(flat).toContain('The blues (a group: stripes of its garments)');
      // The top, drawn between its heading and the first source: block 1 in stripes of blue and navy.
      const y = (s: string) => pages[0]!.text.find((x) => x.str.startsWith(s))!.y;
      const inTop = pages[0]!.paths.filter((pa) => pa.y < y('The top') && pa.y > y('From the') && pa.x < 250);
      const fills = new Set(inTop.map((pa) => pa.fill));
      expect(fills.has(blueHex)).toBe(true);
      expect(fills.has(navyHex)).toBe(true);
    });
  });
});

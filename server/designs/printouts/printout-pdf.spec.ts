import { PAPERS, PRINTOUTS, buildPrintout, contentWords, printoutPdfs, type DesignBody, type Paper, type PrintoutContent } from '@keepstitch/shared';
import { today } from '../../core/calendar';
import { ApiAgent, addUser, signedIn, startTestApp, type TestApp } from '../../testing/test-app';
import { addCommission } from '../../testing/fixtures';
import { readPdf } from '../../testing/pdf-reader';
import { POCKET, inch } from '../../../shared/src/testing/design-fixtures';

/** Words as compared: spacing aside (the PDF breaks lines and splits bold runs into items of their own). */
const flat = (s: string) => s.replace(/\s+/g, ' ').trim();

describe('printouts: the PDF and the print page say the same words, from one content model', () => {
  let t: TestApp;
  let owner: ApiAgent;
  let commissionId: number;

  beforeAll(async () => {
    t = await startTestApp();
    const o = await addUser(t.knex, 'owner');
    const c = await addUser(t.knex, 'client');
    owner = await signedIn(t.app, o.email);
    commissionId = await addCommission(t.knex, c.clientId!, { title: 'Pocket quilt', ageGroup: 'baby_under_1' });
    // A knit, directional polo (both cutting notes) and a flannel shirt whose left front keeps a pocket.
    const garment = async (description: string, colour: string, fibre: string, construction: string, print: string, panels: [string, number, number, unknown[]][]) => {
      const [g] = await t.knex('garments').insert({ commissionId, description, colour, fibre, construction, print, features: '[]' }).returning('id');
      await t.knex('panels').insert(panels.map(([name, w, h, features]) => ({ garmentId: g.id, name, widthMm: inch(w), heightMm: inch(h), grain: 'vertical', features: JSON.stringify(features) })));
      return g.id as number;
    };
    const polo = await garment('Navy knit polo', 'Navy', 'knit_jersey', 'knit', 'directional', [['back', 20, 26, []]]);
    await garment('Green flannel shirt', 'Green', 'flannel', 'woven', 'non_directional', [['left front', 12, 24, [POCKET]], ['back', 22, 27, []]]);
    const [calico] = await t.knex('stockFabrics').insert({ name: 'Unbleached calico', colour: 'Natural', fibre: 'cotton', widthMm: inch(44), lengthMm: inch(72), costPence: 800, costUnit: 'metre' }).returning('id');
    const body: DesignBody = {
      units: 'imperial',
      target: { preset: null, dropMm: null, widthMm: inch(16), lengthMm: inch(16) },
      layout: { setting: 'straight', rows: 2, columns: 2, blockMm: inch(8), sashing: null, borders: [] },
      blocks: [
        { id: 'A', name: 'Shirt plate', kind: 'plate', blades: 20, outerRadiusMm: inch(3), innerRadiusMm: inch(1) },
        { id: 'B', name: 'Whole shirt square', kind: 'square' },
      ],
      pattern: ['A', 'B', 'B', 'B'],
      groups: [],
      assignments: [
        { target: { kind: 'piece', key: 'block:A:background' }, fabric: { kind: 'stock', stockId: calico.id } },
        { target: { kind: 'piece', key: 'block:A:centre' }, fabric: { kind: 'stock', stockId: calico.id } },
        { target: { kind: 'position', index: 1 }, fabric: { kind: 'garment', garmentId: polo } },
      ],
      finishing: { bindingStockId: calico.id, bindingStripMm: inch(2.5), backingStockId: null, waddingStockId: null, prewash: true, shrinkPercent: '3' },
      rules: { minimumPerGarment: 0 },
    };
    expect((await owner.post(`/api/commissions/${commissionId}/design`, { body }).then((r) => r.status))).toBe(201);
  });
  afterAll(() => t.close());

  /** The content as the print page builds it: from what the page loads, through the same registry. */
  async function pageContent(p: (typeof PRINTOUTS)[number], paper?: Paper): Promise<PrintoutContent> {
    const options = { printedOn: today(), ...(paper ? { paper } : {}) };
    if (p.source === 'design') {
      const s = (await owner.get(`/api/commissions/${commissionId}/design`)).body;
      return buildPrintout(p, { commission: s.commission, version: s.current, garments: s.garments, stock: s.stock, fabrics: s.fabrics }, options);
    }
    return buildPrintout(p, (await owner.get(`/api/commissions/${commissionId}/care-card`)).body, options);
  }

  async function pdfText(p: (typeof PRINTOUTS)[number], paper?: Paper): Promise<string> {
    const pdf = printoutPdfs(p, commissionId).find((x) => x.paper === paper)!;
    const res = await owner.get(pdf.url);
    expect(res.status).toBe(200);
    return flat(readPdf(res.body as Buffer).text);
  }

  it.each(PRINTOUTS.map((p) => [p.id, p] as const))('%s: every word of the page that is not about the page is in the PDF', async (_id, p) => {
    const page = await pageContent(p);
    for (const paper of p.papers ?? [undefined]) {
      // The PDF's content: the page's, with the sheet it is laid out for named where the printout offers a choice.
      const content = await pageContent(p, paper);
      const named = (w: string) => (paper ? w.replace(`, ${PAPERS[paper]}`, '') : w);
      expect(contentWords(content, 'page').map(named)).toEqual(contentWords(page, 'page'));
      const text = await pdfText(p, paper);
      // A printout in sheets heads each sheet with its section (a template's name), not the printout's title.
      const words = contentWords(content, 'pdf').filter((_w, i) => !(content.layout === 'sheets' && i === 0));
      expect(words.length).toBeGreaterThan(3);
      expect(words.map(flat).filter((w) => w && !text.includes(w))).toEqual([]);
    }
    // And the page says nothing the PDF does not, other than what is about the page itself.
    const inPdf = new Set(contentWords(page, 'pdf'));
    expect(contentWords(page, 'page').filter((w) => !inPdf.has(w)).every((w) => /browser/.test(w))).toBe(true);
  });

  it('says "back of each panel" for a knit garment on the page and in the PDF alike, with the pocket kept', async () => {
    const p = PRINTOUTS.find((x) => x.id === 'cut-list')!;
    const page = contentWords(await pageContent(p), 'page').join(' ');
    const text = await pdfText(p);
    for (const words of [
      'Knit: fuse a stabiliser to the back of each panel before cutting.',
      'Directional print: pieces are laid the right way up; do not turn them.',
      'Kept feature: 1 of these keeps the breast pocket from the Green flannel shirt, centred',
    ]) {
      expect(page).toContain(words);
      expect(text).toContain(words);
    }
  });
});

import { deriveDesign } from '../design/derive-design';
import { planDesign, type DesignSources } from '../design/plan-design';
import { SAFE_SLEEP } from '../workflow/cautions';
import { POCKET, flannelShirt, inch, squaresDesign } from '../testing/design-fixtures';
import type { DesignBody } from '../design/design-body';
import { PRINTOUTS, buildPrintout, printoutFileName, printoutOf, printoutPdfs, printoutRoute } from './printouts';
import { contentFigures, contentWords, type Figure, type PrintoutContent } from './printout-content';
import type { PrintableDesign } from './printable-design';
import type { CareCardData } from './care-card-printout';

// Like the demo: plates and whole-shirt squares from a flannel shirt with a pocket kept whole, a knit polo, and a studio fabric.
const body: DesignBody = squaresDesign(8, 2, 2, {
  blocks: [
    { id: 'A', name: 'Shirt plate', kind: 'plate', blades: 20, outerRadiusMm: inch(3), innerRadiusMm: inch(1) },
    { id: 'B', name: 'Whole shirt square', kind: 'square' },
  ],
  pattern: ['A', 'B', 'B', 'B'],
  assignments: [
    { target: { kind: 'piece', key: 'block:A:background' }, fabric: { kind: 'stock', stockId: 3 } },
    { target: { kind: 'piece', key: 'block:A:centre' }, fabric: { kind: 'stock', stockId: 3 } },
    { target: { kind: 'position', index: 1 }, fabric: { kind: 'garment', garmentId: 8 } },
  ],
});
const shirt = flannelShirt(12, [POCKET]).garments[0]!;
const sources: DesignSources = {
  garments: [shirt, { id: 8, description: 'Navy knit polo', colour: 'Navy', fibre: 'knit_jersey', construction: 'knit', print: 'directional', panels: [{ id: 81, name: 'back', widthMm: inch(20), heightMm: inch(26), grain: 'vertical', features: [] }] }],
  stock: [{ id: 3, name: 'Unbleached calico', colour: 'Natural', fibre: 'cotton', widthMm: inch(44), lengthMm: inch(72), costUnit: 'metre' }],
};
const derived = deriveDesign(body);
const plan = planDesign(body, derived, sources);
const design: PrintableDesign = {
  commission: { id: 5, title: 'Work-shirt memory quilt' },
  version: { version: 3, body, derived, plan },
  garments: sources.garments,
  stock: sources.stock,
  fabrics: [
    { key: 'garment:7', name: 'Green flannel shirt', hex: '#4f7a52' },
    { key: 'garment:8', name: 'Navy knit polo', hex: '#26355d' },
    { key: 'stock:3', name: 'Unbleached calico', hex: '#efe6d2' },
  ],
};
const card: CareCardData = {
  commission: { id: 5, title: 'Baby blanket', kind: 'baby_quilt', ageGroup: 'baby_under_1' },
  maker: 'Ottilie Marsh',
  washing: ['Wash cool.', 'Dry flat.'],
  fibres: [{ fibre: 'cotton', garments: ['Blue shirt'], studio: ['Calico'] }],
  cautions: [SAFE_SLEEP],
  deferNote: 'These notes are guidance.',
};
const options = { printedOn: '2026-12-04' };
const build = (id: string, paper?: 'a4' | 'letter'): PrintoutContent => {
  const p = printoutOf(id)!;
  return buildPrintout(p, (p.source === 'design' ? design : card) as never, { ...options, paper });
};
const kinds = (figures: Figure[]) => figures.map((f) => f.kind);

describe('printouts', () => {
  it('lists each printout once, with who may print it and where its PDF is', () => {
    expect(PRINTOUTS.map((p) => p.id)).toEqual(['cut-list', 'sewing-order', 'templates', 'care-card']);
    expect(new Set(PRINTOUTS.map((p) => p.id)).size).toBe(PRINTOUTS.length);
    expect(PRINTOUTS.map(printoutRoute)).toEqual([
      'GET /api/commissions/:id/design/cut-list.pdf',
      'GET /api/commissions/:id/design/sewing-order.pdf',
      'GET /api/commissions/:id/design/templates.pdf',
      'GET /api/commissions/:id/care-card.pdf',
    ]);
    expect(printoutPdfs(printoutOf('templates')!, 5).map((x) => x.url)).toEqual(['/api/commissions/5/design/templates.pdf?paper=a4', '/api/commissions/5/design/templates.pdf?paper=letter']);
    expect(printoutOf('care-card')!.roles).toContain('client');
    expect(PRINTOUTS.filter((p) => p.roles.includes('client')).map((p) => p.id)).toEqual(['care-card']);
    expect(printoutFileName(printoutOf('templates')!, design, 'a4')).toBe('templates-5-v3-a4.pdf');
    expect(printoutFileName(printoutOf('care-card')!, card)).toBe('care-card-5.pdf');
  });

  it('builds the cut list: the top with its key, a section for each source with a diagram for each panel, kept feature named', () => {
    const c = build('cut-list');
    expect(c.title).toBe('Cut list');
    expect(c.meta[0]).toBe('Work-shirt memory quilt, design version 3, printed 4 Dec 2026');
    const headings = c.sections.map((s) => s.heading);
    expect(headings[0]).toBe('The top');
    expect(headings).toContain('From the Green flannel shirt (green)');
    expect(headings).toContain('From the Navy knit polo (Navy)');
    expect(headings).toContain('From the studio fabric: Unbleached calico');
    const figures = contentFigures(c);
    expect(figures[0]!.kind).toBe('quilt-top');
    const top = figures[0]!;
    if (top.kind !== 'quilt-top') throw new Error('no top');
    // The plates' calico, the polo's square and the planner's choice for the other two squares.
    expect(top.key.map((k) => k.name)).toEqual(['Navy knit polo', 'Unbleached calico', 'Planner chooses (any garment)']);
    expect(top.keptKey).toEqual([expect.stringMatching(/^Block \d keeps the breast pocket from the Green flannel shirt: that block's piece is cut with the feature centred\.$/)]);
    // One panel diagram for each panel cut from, beside its cuts.
    const panelsCut = plan.plan.panels.filter((p) => p.piecesCut > 0).length;
    expect(figures.filter((f) => f.kind === 'panel')).toHaveLength(panelsCut);
    const keptPieces = figures.flatMap((f) => (f.kind === 'panel' ? f.pieces.filter((p) => p.kept) : []));
    expect(keptPieces).toHaveLength(1);
    expect(keptPieces[0]!.feature).toEqual({ x: 50.8, y: 101.6, width: 127, height: 139.7 });
    const words = contentWords(c, 'pdf').join('\n');
    expect(words).toContain('Kept feature: 1 of these keeps the breast pocket from the Green flannel shirt, centred');
    // The polo is knit and directional: both notes, in one wording.
    expect(words).toContain('Knit: fuse a stabiliser to the back of each panel before cutting. Directional print: pieces are laid the right way up; do not turn them.');
    expect(words).toMatch(/left front, 12 in × 24 in/);
  });

  it('builds the sewing order: a section of counted steps and a pressing note for each block kind and the top', () => {
    const c = build('sewing-order');
    expect(c.sections.map((s) => s.heading)).toEqual(derived.sewing.map((s) => s.title));
    const plate = c.sections[0]!;
    const steps = plate.blocks[0]!;
    if (steps.kind !== 'list') throw new Error('no steps');
    // Hand-worked: a 20-blade plate is 10 pairs.
    expect(steps.items[0]).toEqual({ text: 'Sew the blades into 10 pairs', count: 10 });
    expect(contentWords(c, 'page')).toContain(`Pressing: ${derived.sewing[0]!.pressing}`);
    expect(contentFigures(c)).toEqual([]);
  });

  it('builds the templates: check squares, then one sheet for each curved piece drawn full size', () => {
    const c = build('templates', 'letter');
    expect(c.layout).toBe('sheets');
    expect(c.meta).toEqual(['Work-shirt memory quilt, design version 3, US Letter, printed 4 Dec 2026. Full size.']);
    expect(kinds(contentFigures(c))).toEqual(['check-squares', 'template', 'template']);
    expect(c.sections.slice(1).map((s) => s.heading)).toEqual(['Block A blade (20 of 360 degrees)', 'Block A centre circle']);
    // The scale note speaks of the browser: the page has it, the PDF does not.
    expect(contentWords(c, 'page').join(' ')).toContain('A browser may scale a page');
    expect(contentWords(c, 'pdf').join(' ')).not.toContain('A browser may scale a page');
    const squares = squaresDesign();
    const none = buildPrintout(printoutOf('templates')!, { ...design, version: { version: 1, body: squares, derived: deriveDesign(squares), plan } }, options);
    expect(kinds(contentFigures(none))).toEqual(['check-squares']);
    expect(contentWords(none, 'pdf')).toContain('This design has no curved pieces, so it needs no templates.');
  });

  it('builds the care card: washing, fibres with the studio fabrics, the safety notices and the deferring note', () => {
    const c = build('care-card');
    expect(c.title).toBe('Caring for your baby quilt');
    expect(c.meta).toEqual(['Baby blanket', 'Made by Ottilie Marsh']);
    expect(c.sections.map((s) => s.heading)).toEqual(['Washing and pressing', 'What went into it', 'Safety', undefined]);
    expect(contentWords(c, 'pdf')).toEqual(expect.arrayContaining(['Cotton: Blue shirt; Calico (studio fabric)', SAFE_SLEEP.title, SAFE_SLEEP.source, 'These notes are guidance.']));
    const noNotice = buildPrintout(printoutOf('care-card')!, { ...card, cautions: [], fibres: [] }, options);
    expect(noNotice.sections.map((s) => s.heading)).not.toContain('Safety');
    expect(contentWords(noNotice, 'page')).toContain('No fabrics recorded yet.');
  });

  it('says there is no saved design rather than printing an empty one', () => {
    for (const id of ['cut-list', 'sewing-order', 'templates']) {
      expect(contentWords(buildPrintout(printoutOf(id)!, { ...design, version: null } as never, options), 'page')).toContain('This commission has no saved design yet.');
    }
  });
});

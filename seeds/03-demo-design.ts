import type { Knex } from 'knex';
import { deriveDesign, planDesign, type DesignSources } from '../shared/src/index';
import { DEMO_ACCOUNTS } from './demo/accounts';
import { demoDesign } from './demo/design';

/**
 * The demo memory quilt's design in two versions: the first shared with the
 * client, who asked for a change; the second (current) with borders, planned
 * against the shirts' panels and the studio stock. Earlier seeds reset the
 * commissions, so this one only inserts.
 */
export async function seed(knex: Knex): Promise<void> {
  const quilt = await knex('commissions').where({ title: 'Work-shirt memory quilt' }).first();
  if (!quilt) return;
  const owner = await knex('users').where({ email: DEMO_ACCOUNTS.owner.email }).first();
  const garments = await knex('garments').where({ commissionId: quilt.id }).orderBy('id');
  const panels = await knex('panels').whereIn('garmentId', garments.map((g) => g.id)).orderBy('id');
  const stock = await knex('stockFabrics').orderBy('id');
  const stockId = (name: RegExp) => stock.find((s) => name.test(s.name))!.id as number;
  const sources: DesignSources = {
    garments: garments.map((g) => ({
      id: g.id, description: g.description, colour: g.colour, fibre: g.fibre, construction: g.construction, print: g.print,
      panels: panels.filter((p) => p.garmentId === g.id).map((p) => ({ id: p.id, name: p.name, widthMm: p.widthMm, heightMm: p.heightMm, grain: p.grain, features: p.features })),
    })),
    stock: stock.map((s) => ({ id: s.id, name: s.name, colour: s.colour, fibre: s.fibre, widthMm: s.widthMm, lengthMm: s.lengthMm, costUnit: s.costUnit })),
  };
  const current = demoDesign(garments.map((g) => g.id as number), { calico: stockId(/calico/i), navy: stockId(/navy/i), wadding: stockId(/wadding/i) });
  // Version 1: the same blocks without the borders (a smaller top), shared with the client.
  const first = { ...current, layout: { ...current.layout, borders: [current.layout.borders[0]!] }, assignments: current.assignments.filter((a) => !(a.target.kind === 'piece' && a.target.key === 'border:2')) };
  const day = (offset: number) => new Date(Date.now() + offset * 86_400_000);
  for (const [version, body, extra] of [
    [1, first, { note: 'First layout: plates, squares and triangles with sashing', sharedAt: day(-3), clientResponse: 'changes_requested', clientNote: 'Could it be a little longer, so it tucks under the pillows? And I love the plates.', respondedAt: day(-2), createdAt: day(-4) }],
    [2, current, { note: 'Added a 7 in navy border for length', createdAt: day(-1) }],
  ] as const) {
    const derived = deriveDesign(body);
    const plan = planDesign(body, derived, sources);
    await knex('designVersions').insert({
      commissionId: quilt.id,
      version,
      body: JSON.stringify(body),
      derived: JSON.stringify(derived),
      plan: JSON.stringify(plan),
      createdBy: owner.id,
      ...extra,
    });
  }
}

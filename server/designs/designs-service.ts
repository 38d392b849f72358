import {
  DomainError,
  cautionsFor,
  deriveDesign,
  fabricColour,
  fabricKey,
  garmentColour,
  garmentGroups,
  groupLegendEntry,
  keptFeaturePieces,
  designKeptFeatures,
  planDesign,
  type DesignBody,
  type DesignPlanSummary,
  type DesignSources,
  type FabricRef,
  type FibreGroup,
  type PrintableDesign,
} from '@keepstitch/shared';
import { AppError } from '../core/app-error';
import { nextVersion } from '../core/paging';
import { present } from '../core/field-policy';
import type { Role } from '../core/roles';
import { findVisibleCommission } from '../commissions/commission-access';
import { CommissionModel } from '../models/commission-model';
import type { GarmentModel } from '../models/garment-model';
import { StockFabricModel } from '../models/stock-fabric-model';
import { UserModel } from '../models/user-model';
import { DesignVersionModel, type ClientResponse } from '../models/design-model';

const NO_DESIGN = 'A design for this commission';

/** The garments (with their measured panels) and the studio stock a design is planned against. */
export async function designSources(commissionId: number): Promise<DesignSources & { garmentRows: GarmentModel[]; stockRows: StockFabricModel[] }> {
  const garmentRows = await CommissionModel.relatedQuery('garments').for(commissionId).withGraphFetched('panels');
  const stockRows = await StockFabricModel.query().orderBy('id');
  return {
    garmentRows,
    stockRows,
    garments: garmentRows.map((g) => ({
      id: g.id,
      description: g.description,
      colour: g.colour,
      fibre: g.fibre ?? 'other',
      construction: g.construction,
      print: g.print,
      panels: (g.panels ?? []).map((p) => ({ id: p.id, name: p.name, widthMm: p.widthMm, heightMm: p.heightMm, grain: p.grain, features: p.features ?? [] })),
    })),
    stock: stockRows.map((s) => ({ id: s.id, name: s.name, colour: s.colour, fibre: s.fibre, widthMm: s.widthMm, lengthMm: s.lengthMm, costUnit: s.costUnit })),
  };
}

export interface LegendItem {
  key: string;
  kind: 'garment' | 'stock' | 'group';
  id: number | null;
  name: string;
  colour: string | null;
  /** The colour it is drawn in; for a group, the mean of its stripes. */
  hex: string;
  /** A group only: drawn in stripes of its garments' colours. */
  stripes?: string[];
  detail: string;
}

/**
 * Every fabric a design may name, with the colour it is drawn in: garments of
 * the commission, the stock, and the design's groups (given to something or
 * not yet), each in stripes of its garments' colours as the app draws them.
 */
function fabricLegend(sources: DesignSources, body?: DesignBody): LegendItem[] {
  const items: LegendItem[] = [];
  const garmentHex = new Map<number, string>();
  for (const g of sources.garments) {
    garmentHex.set(g.id, garmentColour(g));
    items.push({ key: fabricKey({ kind: 'garment', garmentId: g.id }), kind: 'garment', id: g.id, name: g.description, colour: g.colour, hex: garmentHex.get(g.id)!, detail: `${g.panels.length} panel${g.panels.length === 1 ? '' : 's'}${g.print === 'directional' ? ', directional print' : ''}${g.construction === 'knit' ? ', knit' : ''}` });
  }
  for (const s of sources.stock) {
    items.push({ key: fabricKey({ kind: 'stock', stockId: s.id }), kind: 'stock', id: s.id, name: s.name, colour: s.colour, hex: fabricColour(`${s.colour ?? ''} ${s.name}`), detail: 'studio fabric' });
  }
  for (const g of body ? garmentGroups(body) : []) items.push({ ...groupLegendEntry(g, (id) => garmentHex.get(id)), kind: 'group', id: null, colour: null });
  return items;
}

/** A plan with its kept features listed: plans stored before they were are read from their placements. */
function withKeptFeatures(plan: DesignPlanSummary, sources: DesignSources): DesignPlanSummary {
  return plan.keptFeatures ? plan : { ...plan, keptFeatures: keptFeaturePieces(plan, sources) };
}

/** Checks every fabric the design names is a garment of this commission or a stock fabric. */
function checkFabrics(body: DesignBody, sources: DesignSources): void {
  const garments = new Set(sources.garments.map((g) => g.id));
  const stock = new Set(sources.stock.map((s) => s.id));
  const bad: Record<string, string> = {};
  const check = (f: FabricRef, path: string) => {
    if (f.kind === 'stock' && !stock.has(f.stockId)) bad[path] = 'No such studio fabric.';
    if (f.kind === 'garment' && !garments.has(f.garmentId)) bad[path] = 'That garment is not part of this commission.';
  };
  body.assignments.forEach((a, i) => check(a.fabric, `assignments.${i}.fabric`));
  garmentGroups(body).forEach((g, i) => {
    if (g.garmentIds.some((id) => !garments.has(id))) bad[`groups.${i}.garmentIds`] = 'A garment of the group is not part of this commission.';
  });
  for (const k of ['bindingStockId', 'backingStockId', 'waddingStockId'] as const) {
    const v = body.finishing[k];
    if (v !== null && !stock.has(v)) bad[`finishing.${k}`] = 'No such studio fabric.';
  }
  if (Object.keys(bad).length) throw new AppError(400, 'validation', 'The design names fabrics that cannot be used.', bad);
}

/** Derives and plans a design, turning the maths' refusals into a 400 the maker can act on. */
export function deriveAndPlan(body: DesignBody, sources: DesignSources) {
  try {
    const derived = deriveDesign(body);
    const plan = planDesign(body, derived, sources);
    return { derived, plan };
  } catch (err) {
    if (err instanceof DomainError) throw new AppError(400, 'design_invalid', err.message, { [err.field ?? 'design']: err.message });
    throw err;
  }
}

async function staffCommission(user: Express.User, id: number) {
  const c = await findVisibleCommission(user, id);
  return c;
}

function commissionView(c: CommissionModel, role: Role) {
  return present('commission', role, { id: c.id, title: c.title, kind: c.kind, ageGroup: c.ageGroup, sizePreset: c.sizePreset, widthMm: c.widthMm, lengthMm: c.lengthMm, stage: c.stage });
}

function versionView(v: DesignVersionModel, sources: DesignSources, role: Role) {
  return present('designVersion', role, {
    id: v.id,
    version: v.version,
    body: v.body,
    derived: v.derived,
    plan: withKeptFeatures(v.plan, sources),
    note: v.note,
    createdAt: v.createdAt,
    sharedAt: v.sharedAt,
    clientResponse: v.clientResponse,
    clientNote: v.clientNote,
    respondedAt: v.respondedAt,
  });
}

export async function latestVersion(commissionId: number) {
  return CommissionModel.relatedQuery('designVersions').for(commissionId).first();
}

/** The design screen: the latest version with its plan, earlier versions listed, and the fabrics to choose from. */
export async function getDesign(user: Express.User, commissionId: number) {
  const c = await staffCommission(user, commissionId);
  const sources = await designSources(c.id);
  const versions = await CommissionModel.relatedQuery('designVersions')
    .for(c.id)
    .select('id', 'version', 'note', 'createdAt', 'sharedAt', 'clientResponse', 'clientNote', 'respondedAt');
  const latest = versions.length ? await DesignVersionModel.query().findById(versions[0]!.id) : undefined;
  const role = user.role;
  return {
    commission: commissionView(c, role),
    current: latest ? versionView(latest, sources, role) : null,
    versions: versions.map((v) => present('designVersion', role, v.toJSON())),
    fabrics: fabricLegend(sources, latest?.body),
    garments: sources.garments.map((g) => present('garment', role, { id: g.id, description: g.description, colour: g.colour, fibre: g.fibre, print: g.print, construction: g.construction, panels: g.panels })),
    stock: sources.stock.map((s) => present('stock', role, { id: s.id, name: s.name, colour: s.colour, fibre: s.fibre, widthMm: s.widthMm, lengthMm: s.lengthMm })),
  };
}

export async function getVersion(user: Express.User, commissionId: number, version: number) {
  const c = await staffCommission(user, commissionId);
  const v = await DesignVersionModel.query().where({ commissionId: c.id, version }).first();
  if (!v) throw AppError.notFound('That design version');
  return versionView(v, await designSources(c.id), user.role);
}

/** Derives and plans without saving: the design screen's live re-plan. */
export async function previewDesign(user: Express.User, commissionId: number, body: DesignBody) {
  const c = await staffCommission(user, commissionId);
  const sources = await designSources(c.id);
  checkFabrics(body, sources);
  return { ...deriveAndPlan(body, sources), fabrics: fabricLegend(sources, body) };
}

/** Saves the design as a new version (earlier versions are kept) with its derivation and plan. */
export async function saveDesign(user: Express.User, commissionId: number, body: DesignBody, note: string | null | undefined) {
  const c = await staffCommission(user, commissionId);
  const sources = await designSources(c.id);
  checkFabrics(body, sources);
  const { derived, plan } = deriveAndPlan(body, sources);
  const saved = await DesignVersionModel.transaction(async (trx) => {
    await CommissionModel.query(trx).findById(c.id).forUpdate();
    const version = await nextVersion(DesignVersionModel.query(trx).where('commissionId', c.id));
    return DesignVersionModel.query(trx).insertAndFetch({ commissionId: c.id, version, body, derived, plan, note: note ?? null, createdBy: user.id });
  });
  return versionView(saved, sources, user.role);
}

/** Shares the latest version with the client, who may then approve it or ask for a change. */
export async function shareDesign(user: Express.User, commissionId: number) {
  const c = await staffCommission(user, commissionId);
  const latest = await latestVersion(c.id);
  if (!latest) throw AppError.notFound(NO_DESIGN);
  const v = await DesignVersionModel.query().patchAndFetchById(latest.id, { sharedAt: new Date(), clientResponse: null, clientNote: null, respondedAt: null });
  return { version: v.version, sharedAt: v.sharedAt };
}

async function latestShared(commissionId: number) {
  return CommissionModel.relatedQuery('designVersions').for(commissionId).whereNotNull('sharedAt').first();
}

/** What a client sees: the drawing of the latest shared version, and their answer. No plan, no cut list. */
export async function sharedDesign(user: Express.User, commissionId: number) {
  const c = await findVisibleCommission(user, commissionId);
  const v = await latestShared(c.id);
  if (!v) throw AppError.notFound(NO_DESIGN);
  const sources = await designSources(c.id);
  return {
    commission: present('commission', user.role, { id: c.id, title: c.title }),
    version: v.version,
    sharedAt: v.sharedAt,
    body: v.body,
    derived: { finished: v.derived.finished, target: v.derived.target, difference: v.derived.difference, centre: v.derived.centre, parts: v.derived.parts, positions: v.derived.positions, layoutFabrics: v.derived.layoutFabrics, totals: { blocks: v.derived.totals.blocks } },
    fabrics: fabricLegend(sources, v.body).map(({ key, kind, name, hex, stripes }) => ({ key, kind, name, hex, ...(stripes ? { stripes } : {}) })),
    // Where the kept features go, in the client's own garments' words; nothing of the plan itself.
    keptFeatures: designKeptFeatures(v, sources).map(({ position, rail, feature, garment }) => ({ position, rail, feature, garment })),
    clientResponse: v.clientResponse,
    clientNote: v.clientNote,
    respondedAt: v.respondedAt,
  };
}

/** The client approves the shared design or asks for a change with a note; the owner sees it on the version. */
export async function respondToDesign(user: Express.User, commissionId: number, response: ClientResponse, note: string | null | undefined) {
  const c = await findVisibleCommission(user, commissionId);
  const v = await latestShared(c.id);
  if (!v) throw AppError.notFound(NO_DESIGN);
  const saved = await DesignVersionModel.query().patchAndFetchById(v.id, { clientResponse: response, clientNote: note ?? null, respondedAt: new Date() });
  return { version: saved.version, clientResponse: saved.clientResponse, clientNote: saved.clientNote, respondedAt: saved.respondedAt };
}

/** The latest version for the printouts, with everything they name. */
export async function printable(user: Express.User, commissionId: number): Promise<PrintableDesign> {
  const c = await staffCommission(user, commissionId);
  const v = await latestVersion(c.id);
  if (!v) throw AppError.notFound(NO_DESIGN);
  const sources = await designSources(c.id);
  return { commission: { id: c.id, title: c.title }, version: v, garments: sources.garments, stock: sources.stock, fabrics: fabricLegend(sources, v.body) };
}

const WASHING = [
  'Wash cool (30 °C at most) on a gentle cycle, with a mild detergent and no bleach.',
  'Add a colour-catcher sheet to each wash: the piece mixes fabrics from different garments.',
  'Dry flat, out of direct sun; do not tumble dry.',
  'Press with a warm iron through a cloth, lifting and pressing rather than rubbing.',
  'Store folded loosely in a cotton bag, refolding now and then along different lines.',
];

/** The care card: washing, what went into the piece, who made it, and the notices that apply. */
export async function careCard(user: Express.User, commissionId: number) {
  const c = await findVisibleCommission(user, commissionId);
  const garments = await CommissionModel.relatedQuery('garments').for(c.id);
  const v = await latestVersion(c.id);
  // One line per fibre: the client's garments first, then the studio's own fabrics of that fibre.
  const fibres = new Map<string, FibreGroup>();
  const groupOf = (fibre: string) => fibres.get(fibre) ?? fibres.set(fibre, { fibre, garments: [], studio: [] }).get(fibre)!;
  // A garment whose fibre is not known yet is listed as such, not guessed.
  for (const g of garments) groupOf(g.fibre ?? 'unknown').garments.push(g.description);
  if (v) {
    const ids = new Set<number>();
    for (const p of v.derived.pieces) if (p.fabric?.kind === 'stock') ids.add(p.fabric.stockId);
    for (const k of ['bindingStockId', 'backingStockId', 'waddingStockId'] as const) if (v.body.finishing[k] !== null) ids.add(v.body.finishing[k]!);
    const rows = ids.size ? await StockFabricModel.query().whereIn('id', [...ids]).orderBy('id') : [];
    for (const s of rows) groupOf(s.fibre).studio.push(s.name);
  }
  const maker = v?.createdBy ? await UserModel.query().findById(v.createdBy) : await UserModel.query().where('role', 'owner').orderBy('id').first();
  const knit = garments.some((g) => g.construction === 'knit');
  return {
    commission: { id: c.id, title: c.title, kind: c.kind, ageGroup: c.ageGroup },
    maker: maker?.name ?? 'The maker',
    washing: knit ? [...WASHING, 'Knit pieces are backed with a fusible stabiliser: do not wring or stretch them.'] : WASHING,
    fibres: [...fibres.values()],
    cautions: cautionsFor(c.ageGroup),
    deferNote: 'These notes are guidance. Where local guidance, a health visitor or a doctor advises differently, follow their advice.',
  };
}

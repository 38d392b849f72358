import { cautionsFor, compareHours, featuresToRemove, nextStages, stageOptions } from '@keepstitch/shared';
import { AppError } from '../core/app-error';
import { present } from '../core/field-policy';
import { readTogether } from '../core/read-together';
import { ClientModel } from '../models/client-model';
import { CommissionModel, HoursModel } from '../models/commission-model';
import { GarmentModel } from '../models/garment-model';
import { QuoteLineModel, QuoteModel } from '../models/quote-model';
import { StudioSettingsModel } from '../models/settings-model';
import { commissionView } from '../commissions/commissions-service';
import { commissionCustodyEvents, statesFrom } from '../garments/custody';
import { garmentView } from '../garments/garment-view';
import { acceptedQuote, paidPayments, paymentStateFrom } from '../payments/payment-state';
import { factsFrom } from './stage-facts';

const NOT_FOUND = 'That commission';

/**
 * Groups rows by a key, keeping their order. The page's reads are the models'
 * relations (a commission's garments, their panels, its photos...), sent in
 * one round trip rather than one query per relation level as withGraphFetched
 * would; this puts each garment's panels and photos back beside it.
 */
function groupBy<T>(rows: T[], key: (row: T) => number | null): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const row of rows) {
    const k = key(row);
    if (k === null) continue;
    const list = out.get(k);
    if (list) list.push(row);
    else out.set(k, [row]);
  }
  return out;
}

export async function getCommission(user: Express.User, id: number) {
  const staff = user.role !== 'client';
  const owner = user.role === 'owner';
  const ownerOnly = <Q extends { whereRaw(sql: string): Q }>(q: Q) => (owner ? q : q.whereRaw('false'));
  // Everything the page shows, read in one round trip; the later reads are discarded when the commission is not visible.
  const [found, garments, events, panels, photos, moves, quotes, paid, hourRows, compared, comparedLines, settings] = await readTogether([
    CommissionModel.query()
      .modify('visibleTo', user)
      .join('clients as client', 'client.id', 'commissions.clientId')
      .select('commissions.*', 'client.name as clientName')
      .where('commissions.id', id),
    CommissionModel.relatedQuery('garments').for(id),
    commissionCustodyEvents(id),
    // A client sees no panels and no hours: those reads come back empty.
    GarmentModel.relatedQuery('panels').for(CommissionModel.relatedQuery('garments').for(id).select('garments.id')).modify((q) => (staff ? q : q.whereRaw('false'))).orderBy('panels.id'),
    CommissionModel.relatedQuery('photos').for(id),
    CommissionModel.relatedQuery('stageMoves').for(id),
    acceptedQuote(id),
    paidPayments(id),
    hoursQuery(id).modify((q) => (staff ? q : q.whereRaw('false'))),
    // Quoted against logged, for the owner only: the quote the hours are held against, its labour lines and the rate.
    comparedQuote(id).modify(ownerOnly),
    QuoteLineModel.query().where('kind', 'labour').whereIn('quoteId', comparedQuote(id).select('id')).modify(ownerOnly),
    StudioSettingsModel.query().where('id', 1).modify(ownerOnly),
  ]);
  const c = found[0];
  if (!c) throw AppError.notFound(NOT_FOUND);
  c.client = ClientModel.fromJson({ id: c.clientId, name: (c as CommissionModel & { clientName: string }).clientName }, { skipValidation: true });
  const money = paymentStateFrom(quotes[0], paid);
  const hours = staff ? hoursFrom(hourRows) : undefined;
  const states = statesFrom(garments.map((g) => g.id), events);
  const panelsOf = groupBy(panels, (p) => p.garmentId);
  const photosOf = groupBy(photos, (p) => p.garmentId);
  const facts = factsFrom(states, money, garments);
  const garmentViews = garments.map((g) => {
    const custody = states.get(g.id)!;
    return present('garment', user.role, {
      ...garmentView(g, user),
      status: custody.state.status,
      received: custody.state.received,
      washed: custody.state.washed,
      place: staff ? custody.state.place : undefined,
      removeForSafety: featuresToRemove(c.ageGroup, g.features),
      panels: staff ? (panelsOf.get(g.id) ?? []) : undefined,
      photos: (photosOf.get(g.id) ?? []).map((p) => p.toPublic()),
    });
  });
  return present('commission', user.role, {
    ...commissionView(c, user),
    cautions: cautionsFor(c.ageGroup),
    garments: garmentViews,
    progressPhotos: photos.filter((p) => p.kind === 'progress').map((p) => p.toPublic()),
    stageHistory: moves.map((m) => ({ id: m.id, fromStage: m.fromStage, toStage: m.toStage, note: staff ? m.note : undefined, movedAt: m.movedAt })),
    hours,
    hoursCompared: owner ? hoursCompared(compared[0], comparedLines, hourRows, settings[0]) : undefined,
    nextStages: staff ? nextStages(c.stage, facts) : undefined,
    stageOptions: staff ? stageOptions(c.stage, facts) : undefined,
    facts,
  });
}

/** The quote hours are held against: the accepted one, else the latest sent. */
function comparedQuote(commissionId: number) {
  return QuoteModel.query().where('commissionId', commissionId).whereIn('status', ['accepted', 'sent']).orderByRaw("status = 'accepted' desc").orderBy('version', 'desc').limit(1);
}

/** Quoted against logged hours per stage, with the margin at the studio's rate; null before a quote is sent. */
function hoursCompared(quote: QuoteModel | undefined, lines: QuoteLineModel[], logged: HoursModel[], settings: StudioSettingsModel | undefined) {
  if (!quote || !settings) return null;
  const labour = lines.map((l) => ({ stage: l.stage, quantity: l.quantity, unitPricePence: l.unitPricePence }));
  return { quoteId: quote.id, quoteVersion: quote.version, quoteStatus: quote.status, ...compareHours(labour, logged.map((h) => ({ stage: h.stage, hours: h.hours })), settings.hourlyRatePence) };
}

/** The hours logged on a commission, with who logged them, in the order worked. */
function hoursQuery(commissionId: number) {
  return CommissionModel.relatedQuery('hours').for(commissionId).leftJoinRelated('user').select('hoursLogged.*', 'user.name as userName');
}

/** Hours per stage and in all, two decimals. */
function hoursFrom(rows: HoursModel[]) {
  const byStage: Record<string, string> = {};
  let total = 0;
  for (const r of rows) {
    byStage[r.stage] = (Number(byStage[r.stage] ?? 0) + Number(r.hours)).toFixed(2);
    total += Number(r.hours);
  }
  return { entries: rows, byStage, total: total.toFixed(2) };
}

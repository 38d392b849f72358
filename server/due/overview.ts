import type { Role } from '../core/roles';
import { addDays, daysBetween, today as todayIs } from '../core/calendar';
import { readTogether } from '../core/read-together';
import { CommissionModel } from '../models/commission-model';
import { CustodyEventModel, GarmentModel } from '../models/garment-model';
import { DesignVersionModel } from '../models/design-model';
import { PaymentModel } from '../models/payment-model';
import { QuoteModel } from '../models/quote-model';
import { statesFrom } from '../garments/custody';
import { paymentStateFrom } from '../payments/payment-state';
import { endOfWeek, weekOf } from './due-dates';

/** Stages after which nothing more is due. */
export const CLOSED_STAGES = ['delivered', 'cancelled'] as const;
/** A sent quote shows on the overview from this many days before it runs out. */
export const QUOTE_EXPIRY_DAYS = 7;

const openCommissions = () => CommissionModel.query().select('commissions.id').whereNotIn('commissions.stage', CLOSED_STAGES);

/** The open commissions' deadlines up to the end of next week, overdue ones included. */
function deadlinesQuery(until: string) {
  return CommissionModel.query()
    .join('clients', 'clients.id', 'commissions.clientId')
    .select('commissions.id', 'commissions.title', 'commissions.stage', 'commissions.deadline', 'clients.name as clientName')
    .whereNotNull('commissions.deadline')
    .where('commissions.deadline', '<=', until)
    .whereNotIn('commissions.stage', CLOSED_STAGES)
    .orderBy('commissions.deadline')
    .orderBy('commissions.id');
}

/** Sent quotes running out between today and a week from now. */
export function expiringQuotesQuery(from: string, until: string) {
  return QuoteModel.query()
    .join('commissions', 'commissions.id', 'quotes.commissionId')
    .select('quotes.id', 'quotes.commissionId', 'quotes.version', 'quotes.validUntil', 'quotes.totalPence', 'commissions.title')
    .where('quotes.status', 'sent')
    .whereBetween('quotes.validUntil', [from, until])
    .whereNotIn('commissions.stage', CLOSED_STAGES)
    .orderBy('quotes.validUntil')
    .orderBy('quotes.id');
}

/** Accepted quotes of open commissions, with the commission's title, stage and deadline. */
export function acceptedQuotesQuery() {
  return QuoteModel.query()
    .join('commissions', 'commissions.id', 'quotes.commissionId')
    .select('quotes.*', 'commissions.title', 'commissions.stage', 'commissions.deadline', 'commissions.clientId')
    .where('quotes.status', 'accepted')
    .whereNotIn('commissions.stage', CLOSED_STAGES)
    .orderBy('quotes.commissionId')
    .orderBy('quotes.version', 'desc');
}

/** The payments that count on open commissions. */
export function paidOnOpenQuery() {
  return PaymentModel.query().where('status', 'paid').whereIn('commissionId', openCommissions());
}

/** The garments of open commissions, with the commission's title. */
export function openGarmentsQuery() {
  return GarmentModel.query()
    .join('commissions', 'commissions.id', 'garments.commissionId')
    .select('garments.id', 'garments.commissionId', 'garments.description', 'garments.createdAt', 'commissions.title', 'commissions.clientId')
    .whereNotIn('commissions.stage', CLOSED_STAGES)
    .orderBy('garments.createdAt')
    .orderBy('garments.id');
}

/** The custody events of those garments. */
export function openGarmentEventsQuery() {
  return CustodyEventModel.query().whereIn('garmentId', GarmentModel.query().select('garments.id').whereIn('garments.commissionId', openCommissions()));
}

/** Each open commission's newest shared design, when the client has not answered it. */
function awaitingDesignsQuery() {
  return DesignVersionModel.query()
    .join('commissions', 'commissions.id', 'designVersions.commissionId')
    .select('designVersions.id', 'designVersions.commissionId', 'designVersions.version', 'designVersions.sharedAt', 'commissions.title')
    .whereNotNull('designVersions.sharedAt')
    .whereNull('designVersions.clientResponse')
    .whereNotIn('commissions.stage', CLOSED_STAGES)
    .whereNotExists(
      DesignVersionModel.query()
        .from('design_versions as newer')
        .whereColumn('newer.commissionId', 'designVersions.commissionId')
        .whereNotNull('newer.sharedAt')
        .whereColumn('newer.version', '>', 'designVersions.version'),
    )
    .orderBy('designVersions.sharedAt')
    .orderBy('designVersions.id');
}

type Row<M> = M & Record<string, unknown>;
const dayOf = (d: Date) => d.toISOString().slice(0, 10);

/** What is still owed on each open commission with an accepted quote, its newest accepted version counting. */
export function balancesFrom(accepted: QuoteModel[], paid: PaymentModel[]) {
  const newest = new Map<number, QuoteModel>();
  for (const q of accepted) if (!newest.has(q.commissionId)) newest.set(q.commissionId, q);
  return [...newest.values()].flatMap((quote) => {
    const state = paymentStateFrom(quote, paid.filter((p) => p.commissionId === quote.commissionId));
    return state ? [{ ...state, quote: quote as Row<QuoteModel> }] : [];
  });
}

/** Garments the studio is still waiting for: no arrival recorded (or it was corrected away). */
export function expectedGarmentsFrom(garments: GarmentModel[], events: CustodyEventModel[]) {
  const states = statesFrom(garments.map((g) => g.id), events);
  return garments.filter((g) => !states.get(g.id)!.state.received) as Row<GarmentModel>[];
}

/**
 * The owner's first screen: what needs her this week and next. Every section
 * is read in one round trip; the workroom gets the same page without money
 * (no quotes, no balances).
 */
export async function overviewFor(role: Role, today = todayIs()) {
  const thisWeekEnds = endOfWeek(today);
  const nextWeekEnds = addDays(thisWeekEnds, 7);
  const money = role === 'owner';
  const [deadlines, garments, events, designs, expiring, accepted, paid] = await readTogether([
    deadlinesQuery(nextWeekEnds),
    openGarmentsQuery(),
    openGarmentEventsQuery(),
    awaitingDesignsQuery(),
    // The workroom's page asks nothing about money.
    expiringQuotesQuery(today, money ? addDays(today, QUOTE_EXPIRY_DAYS) : '0001-01-01'),
    money ? acceptedQuotesQuery() : acceptedQuotesQuery().whereRaw('false'),
    money ? paidOnOpenQuery() : paidOnOpenQuery().whereRaw('false'),
  ] as const);

  const page = {
    today,
    thisWeekEnds,
    nextWeekEnds,
    deadlines: (deadlines as Row<CommissionModel>[]).map((c) => ({
      commissionId: c.id,
      title: c.title,
      clientName: c['clientName'] as string,
      stage: c.stage,
      deadline: c.deadline!,
      daysLeft: daysBetween(today, c.deadline!),
      week: weekOf(c.deadline!, today),
    })),
    garmentsExpected: expectedGarmentsFrom(garments, events).map((g) => ({
      garmentId: g.id,
      commissionId: g.commissionId,
      title: g['title'] as string,
      description: g.description,
      waitingDays: daysBetween(dayOf(g.createdAt), today),
    })),
    designsAwaiting: (designs as Row<DesignVersionModel>[]).map((d) => ({
      commissionId: d.commissionId,
      title: d['title'] as string,
      version: d.version,
      sharedOn: dayOf(d.sharedAt!),
      waitingDays: daysBetween(dayOf(d.sharedAt!), today),
    })),
  };
  if (!money) return page;
  return {
    ...page,
    quotesExpiring: (expiring as Row<QuoteModel>[]).map((q) => ({
      quoteId: q.id,
      commissionId: q.commissionId,
      title: q['title'] as string,
      version: q.version,
      validUntil: q.validUntil!,
      daysLeft: daysBetween(today, q.validUntil!),
      totalPence: q.totalPence,
    })),
    balancesDue: balancesFrom(accepted, paid)
      .filter((b) => b.depositPaid && b.balancePence > 0)
      .map((b) => ({
        commissionId: b.quote.commissionId,
        title: b.quote['title'] as string,
        stage: b.quote['stage'] as string,
        deadline: (b.quote['deadline'] as string | null) ?? null,
        balancePence: b.balancePence,
      }))
      .sort((a, b) => (a.deadline ?? '9999').localeCompare(b.deadline ?? '9999') || a.commissionId - b.commissionId),
  };
}

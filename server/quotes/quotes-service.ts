import { cautionsFor, learnedRatios, mainBlockKind, quoteTotals, suggestQuote, type QuoteTotals } from '@keepstitch/shared';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { nextVersion } from '../core/paging';
import { present } from '../core/field-policy';
import type { Role } from '../core/roles';
import { addDays, today } from '../core/calendar';
import type { AppConfig } from '../core/config';
import { ClientModel } from '../models/client-model';
import { CommissionModel, StageMoveModel } from '../models/commission-model';
import { findVisibleCommission } from '../commissions/commission-access';
import { enqueueMail } from '../mail/outbox-service';
import { quoteMail } from '../mail/mail-templates';
import { clientHasSignIn, inviteWithin } from '../auth/invitations';
import { StudioSettingsModel } from '../models/settings-model';
import { QuoteLineModel, QuoteModel } from '../models/quote-model';
import { latestVersion } from '../designs/designs-service';
import { StockFabricModel } from '../models/stock-fabric-model';
import { quotePdf } from './quote-pdf';
import { finishedCommissions } from './labour-history';
import type { QuoteInput } from './quotes-schemas';

const NOT_FOUND = 'That quote';


function totalsOf(q: QuoteModel): QuoteTotals {
  return quoteTotals({
    lines: (q.lines ?? []).map((l) => ({ quantity: l.quantity, unitPricePence: l.unitPricePence })),
    vatRate: q.vatRate,
    vatMode: q.vatMode,
    depositPercent: q.depositPercent,
  });
}

/** A quote as the API shows it, with its lines and totals. Drafts are computed live; sent quotes keep their frozen totals. */
function quoteParts(q: QuoteModel) {
  const live = totalsOf(q);
  const frozen = q.status !== 'draft' && q.totalPence !== null;
  return {
    id: q.id,
    commissionId: q.commissionId,
    version: q.version,
    status: q.status,
    intro: q.intro,
    validUntil: q.validUntil,
    expired: q.status === 'sent' && q.validUntil !== null && q.validUntil < today(),
    depositPercent: Number(q.depositPercent),
    vatRate: q.vatRate,
    vatMode: q.vatMode,
    lines: (q.lines ?? []).map((l, i) => ({ ...l.toJSON(), quantity: Number(l.quantity).toString(), unitPricePence: Number(l.unitPricePence), netPence: live.lineNetPence[i], vatPence: live.lineVatPence[i] })),
    totals: frozen
      ? { netPence: q.netPence!, vatPence: q.vatPence!, totalPence: q.totalPence!, depositPence: q.depositPence!, balancePence: q.totalPence! - q.depositPence! }
      : { netPence: live.netPence, vatPence: live.vatPence, totalPence: live.totalPence, depositPence: live.depositPence, balancePence: live.balancePence },
    sentAt: q.sentAt,
    acceptedAt: q.acceptedAt,
    acceptedName: q.acceptedName,
    declinedAt: q.declinedAt,
    declineNote: q.declineNote,
    createdAt: q.createdAt,
  };
}

/** A quote as this role may see it. */
export function quoteView(q: QuoteModel, role: Role) {
  const parts = quoteParts(q);
  return present('quote', role, { ...parts, lines: parts.lines.map((l) => present('quoteLine', role, l)) });
}

/** A quote the user may see: clients only see their own, and never drafts. */
async function findVisibleQuote(user: Express.User, id: number, trx?: Knex.Transaction) {
  const q = await QuoteModel.query(trx).findById(id).withGraphFetched('lines');
  if (!q) throw AppError.notFound(NOT_FOUND);
  if (user.role === 'client' && q.status === 'draft') throw AppError.notFound(NOT_FOUND);
  await findVisibleCommission(user, q.commissionId, trx).catch(() => {
    throw AppError.notFound(NOT_FOUND);
  });
  return q;
}

function checkTotals(input: QuoteInput, q: { vatRate: QuoteModel['vatRate']; vatMode: QuoteModel['vatMode']; depositPercent: string }) {
  try {
    quoteTotals({ lines: input.lines, vatRate: q.vatRate, vatMode: q.vatMode, depositPercent: input.depositPercent ?? q.depositPercent });
  } catch (err) {
    throw new AppError(400, 'validation', (err as Error).message, { lines: (err as Error).message });
  }
}

async function writeLines(trx: Knex.Transaction, quoteId: number, input: QuoteInput) {
  await QuoteLineModel.query(trx).delete().where('quoteId', quoteId);
  await QuoteLineModel.query(trx).insert(
    input.lines.map((l, position) => ({ quoteId, position, kind: l.kind, description: l.description, quantity: l.quantity, unit: l.unit, unitPricePence: String(l.unitPricePence), stage: l.stage ?? null })),
  );
}

export async function listQuotes(user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  const query = CommissionModel.relatedQuery('quotes').for(commissionId).withGraphFetched('lines');
  if (user.role === 'client') query.whereNot('status', 'draft');
  return (await query).map((q) => quoteView(q, user.role));
}

export async function getQuote(user: Express.User, id: number) {
  return quoteView(await findVisibleQuote(user, id), user.role);
}

/** A new draft version, priced with the studio's current VAT settings. */
export async function createQuote(user: Express.User, commissionId: number, input: QuoteInput) {
  await findVisibleCommission(user, commissionId);
  const settings = await StudioSettingsModel.current();
  const vat = { vatRate: settings.vatRegistered ? settings.vatRate : null, vatMode: settings.vatMode, depositPercent: String(input.depositPercent ?? settings.depositPercent) };
  checkTotals(input, vat);
  return QuoteModel.transaction(async (trx) => {
    await CommissionModel.query(trx).findById(commissionId).forUpdate();
    const version = await nextVersion(QuoteModel.query(trx).where('commissionId', commissionId));
    const q = await QuoteModel.query(trx).insertAndFetch({ commissionId, version, status: 'draft', intro: input.intro ?? null, ...vat, createdBy: user.id });
    await writeLines(trx, q.id, input);
    return quoteView((await QuoteModel.query(trx).findById(q.id).withGraphFetched('lines'))!, user.role);
  });
}

export async function updateQuote(user: Express.User, id: number, input: QuoteInput) {
  return QuoteModel.transaction(async (trx) => {
    const q = await findVisibleQuote(user, id, trx);
    if (q.status !== 'draft') throw new AppError(409, 'frozen', 'This quote has been sent and cannot change. Make a new version instead.');
    const depositPercent = String(input.depositPercent ?? q.depositPercent);
    checkTotals(input, { vatRate: q.vatRate, vatMode: q.vatMode, depositPercent });
    await QuoteModel.query(trx).patch({ intro: input.intro ?? null, depositPercent }).findById(id);
    await writeLines(trx, id, input);
    return quoteView((await QuoteModel.query(trx).findById(id).withGraphFetched('lines'))!, user.role);
  });
}

async function pdfData(q: QuoteModel) {
  const commission = await CommissionModel.query().findById(q.commissionId);
  const client = await ClientModel.query().findById(commission!.clientId);
  const settings = await StudioSettingsModel.current();
  const studio = (q.studioSnapshot as { name: string; address: string; email: string | null; vatNumber: string | null; paymentTerms: string } | null) ?? {
    name: settings.studioName,
    address: settings.address,
    email: settings.email,
    vatNumber: settings.vatNumber,
    paymentTerms: settings.paymentTerms,
  };
  const view = quoteParts(q);
  return {
    studio,
    client: { name: client!.name, address: client!.address },
    commission: { title: commission!.title, id: commission!.id },
    quote: { version: q.version, sentAt: q.sentAt, validUntil: q.validUntil, intro: q.intro, vatRate: q.vatRate, depositPercent: q.depositPercent },
    lines: view.lines.map((l) => ({ description: l.description, quantity: l.quantity, unit: l.unit, unitPricePence: String(l.unitPricePence), netPence: l.netPence!, vatPence: l.vatPence! })),
    totals: view.totals,
    vatMode: q.vatMode,
    cautions: cautionsFor(commission!.ageGroup),
    clientEmail: client!.email,
  };
}

export async function quotePdfFor(user: Express.User, id: number): Promise<{ pdf: Buffer; fileName: string }> {
  const q = await findVisibleQuote(user, id);
  const data = await pdfData(q);
  return { pdf: await quotePdf(data), fileName: `quote-${q.commissionId}-v${q.version}.pdf` };
}

/**
 * Sends a draft: its totals and the studio's details are frozen, earlier open
 * versions are superseded, the commission moves to "quoted", and the e-mail
 * with the PDF goes into the outbox in the same transaction.
 */
export async function sendQuote(user: Express.User, id: number, config: AppConfig) {
  const result = await QuoteModel.transaction(async (trx) => {
    const q = await findVisibleQuote(user, id, trx);
    await QuoteModel.query(trx).findById(id).forUpdate();
    if (q.status !== 'draft') throw new AppError(409, 'frozen', 'This quote has already been sent.');
    const commission = (await CommissionModel.query(trx).findById(q.commissionId))!;
    const client = (await ClientModel.query(trx).findById(commission.clientId))!;
    if (!client.email) throw new AppError(409, 'no_email', `Add an e-mail address for ${client.name} before sending the quote.`);
    if (['delivered', 'cancelled'].includes(commission.stage)) throw new AppError(409, 'closed', 'This commission is closed; a quote cannot be sent.');
    const settings = await StudioSettingsModel.current(trx);
    const totals = totalsOf(q);
    const sentAt = new Date();
    const validUntil = addDays(today(), settings.validityDays);
    const studioSnapshot = { name: settings.studioName, address: settings.address, email: settings.email, vatNumber: settings.vatNumber, paymentTerms: settings.paymentTerms };
    await QuoteModel.query(trx)
      .patch({ status: 'superseded' })
      .where('commissionId', q.commissionId)
      .where('status', 'sent');
    await QuoteModel.query(trx)
      .patch({ status: 'sent', sentAt, validUntil, netPence: totals.netPence, vatPence: totals.vatPence, totalPence: totals.totalPence, depositPence: totals.depositPence, studioSnapshot })
      .findById(id);
    if (commission.stage === 'enquiry') {
      await CommissionModel.query(trx).patch({ stage: 'quoted' }).findById(commission.id);
      await StageMoveModel.query(trx).insert({ commissionId: commission.id, fromStage: 'enquiry', toStage: 'quoted', movedBy: user.id, note: `Quote version ${q.version} sent` });
    }
    const sent = (await QuoteModel.query(trx).findById(id).withGraphFetched('lines'))!;
    const data = await pdfData(sent);
    const pdf = await quotePdf(data);
    const link = `${config.appUrl}/portal/${commission.id}?quote=${id}`;
    // A client who cannot sign in yet gets an invitation with the quote (unless their e-mail is someone else's sign-in).
    const invitationLink = (await clientHasSignIn(trx, client.id)) ? null : await inviteWithin(trx, client, config.appUrl).catch((err: unknown) => {
      // Its e-mail belongs to another sign-in (checked before anything is written): the quote goes without the invitation.
      if (err instanceof AppError && err.code === 'conflict') return null;
      throw err;
    });
    const mail = quoteMail({
      clientName: client.name,
      studioName: settings.studioName,
      title: commission.title,
      version: q.version,
      totalPence: totals.totalPence,
      depositPence: totals.depositPence,
      validUntil: new Date(`${validUntil}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }),
      link,
      invitationLink,
    });
    await enqueueMail(trx, { kind: 'quote', to: client.email, ...mail, commissionId: commission.id, attachments: [{ filename: `quote-${commission.id}-v${q.version}.pdf`, contentType: 'application/pdf', content: pdf }] });
    return quoteView(sent, user.role);
  });
  return result;
}

/** The client accepts this exact version, by name. */
export async function acceptQuote(user: Express.User, id: number, name: string) {
  return QuoteModel.transaction(async (trx) => {
    const q = await findVisibleQuote(user, id, trx);
    await QuoteModel.query(trx).findById(id).forUpdate();
    if (q.status === 'accepted') throw new AppError(409, 'already_accepted', 'You have already accepted this quote.');
    if (q.status !== 'sent') throw new AppError(409, 'not_open', 'This quote is no longer open: a newer version may have been sent.');
    if (q.validUntil && q.validUntil < today()) throw new AppError(409, 'expired', 'This quote has expired. Please ask the studio for a new one.');
    await QuoteModel.query(trx).patch({ status: 'accepted', acceptedAt: new Date(), acceptedName: name }).findById(id);
    return quoteView((await QuoteModel.query(trx).findById(id).withGraphFetched('lines'))!, user.role);
  });
}

export async function declineQuote(user: Express.User, id: number, note: string | null | undefined) {
  return QuoteModel.transaction(async (trx) => {
    const q = await findVisibleQuote(user, id, trx);
    if (q.status !== 'sent') throw new AppError(409, 'not_open', 'This quote is no longer open.');
    await QuoteModel.query(trx).patch({ status: 'declined', declinedAt: new Date(), declineNote: note ?? null }).findById(id);
    return quoteView((await QuoteModel.query(trx).findById(id).withGraphFetched('lines'))!, user.role);
  });
}

/** The stages a quote's labour lines price. */
const LABOUR_STAGES = ['preparation', 'cutting', 'piecing', 'quilting', 'binding'];

/**
 * Lines for a new quote priced from the commission's current design: every
 * studio fabric the plan uses at its stock cost, and labour by stage from the
 * studio's minutes per block kind and the size; notes for what is left out
 * unpriced; and, per stage, how far logged hours ran from quoted ones on the
 * last finished commissions, for the maker to accept or not. No lines when
 * there is no design yet.
 */
export async function suggestLines(user: Express.User, commissionId: number) {
  await findVisibleCommission(user, commissionId);
  const [design, history] = await Promise.all([latestVersion(commissionId), finishedCommissions(commissionId)]);
  if (!design) return { designVersion: null, lines: [], notes: [], learned: learnedRatios(history, null, LABOUR_STAGES) };
  const [settings, stock, garments] = await Promise.all([
    StudioSettingsModel.current(),
    StockFabricModel.query().select('id', 'name', 'costPence', 'costUnit'),
    CommissionModel.relatedQuery('garments').for(commissionId).select('garments.id', 'garments.construction'),
  ]);
  const { lines, notes } = suggestQuote({
    body: design.body,
    derived: design.derived,
    plan: design.plan,
    stock,
    hourlyRatePence: settings.hourlyRatePence,
    blockMinutes: settings.blockMinutes,
    knitGarments: garments.filter((g) => g.construction === 'knit').length,
    garments: garments.length,
  });
  return { designVersion: design.version, lines, notes, learned: learnedRatios(history, mainBlockKind(design.body, design.derived), LABOUR_STAGES) };
}

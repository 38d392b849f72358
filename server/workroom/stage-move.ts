import { checkStageMove, custodyEnding, moveNeedsNote, nextStages, stageOptions, whatComesBack, type Stage } from '@keepstitch/shared';
import type { Knex } from 'knex';
import { AppError } from '../core/app-error';
import { ClientModel } from '../models/client-model';
import { CommissionModel, StageMoveModel } from '../models/commission-model';
import { StudioSettingsModel } from '../models/settings-model';
import { paymentState } from '../payments/payment-state';
import { enqueueMail } from '../mail/outbox-service';
import { deliveredMail, readyMail } from '../mail/mail-templates';
import { custodyStates, toCustodyEvent } from '../garments/custody';
import { careCardPdf } from '../designs/care-card-pdf';
import { stageFacts } from './stage-facts';

const NOT_FOUND = 'That commission';

/**
 * Moves a commission to another stage by the shared stage rules, with the
 * facts they need (garments in, money owing) read in the same transaction,
 * and records the move; reaching Ready tells the client, and delivery sends
 * the client the care card and what comes back of each garment.
 */
export async function moveStage(user: Express.User, id: number, to: Stage, note: string | null | undefined, appUrl: string) {
  // The care card is drawn first: its reads use connections of their own, which a held transaction must not wait for.
  const card = to === 'delivered' ? await careCardPdf(user, id) : null;
  return CommissionModel.transaction(async (trx) => {
    const c = await CommissionModel.query(trx).findById(id).forUpdate();
    if (!c) throw AppError.notFound(NOT_FOUND);
    const facts = await stageFacts(id, trx);
    const check = checkStageMove(c.stage, to, facts);
    if (!check.ok) throw new AppError(409, 'stage_move_refused', check.reason);
    if (moveNeedsNote(c.stage, to) && !note) {
      throw new AppError(400, 'validation', 'Say why in a note when moving back or cancelling.', { note: 'A note is needed for this move.' });
    }
    await StageMoveModel.query(trx).insert({ commissionId: id, fromStage: c.stage, toStage: to, note: note ?? null, movedBy: user.id });
    await CommissionModel.query(trx).patch({ stage: to }).findById(id);
    let mailed = false;
    if (to === 'ready') mailed = await tellClientReady(trx, c, appUrl);
    if (card) mailed = await tellClientDelivered(trx, c, card, appUrl);
    return { id, stage: to, nextStages: nextStages(to, facts), stageOptions: stageOptions(to, facts), mailed };
  });
}

/** "Your piece is ready", queued with the move that made it so. */
async function tellClientReady(trx: Knex.Transaction, c: CommissionModel, appUrl: string): Promise<boolean> {
  const client = await ClientModel.query(trx).findById(c.clientId);
  if (!client?.email) return false;
  const settings = await StudioSettingsModel.current(trx);
  const money = await paymentState(c.id, trx);
  const mail = readyMail({ clientName: client.name, studioName: settings.studioName, title: c.title, balancePence: money?.balancePaid ? 0 : (money?.balancePence ?? 0), link: `${appUrl}/portal/${c.id}` });
  await enqueueMail(trx, { kind: 'ready', to: client.email, ...mail, commissionId: c.id });
  return true;
}

/** "Delivered", with the care card PDF and one line per garment on what comes back, queued with the move. */
async function tellClientDelivered(trx: Knex.Transaction, c: CommissionModel, card: { pdf: Buffer; fileName: string }, appUrl: string): Promise<boolean> {
  const client = await ClientModel.query(trx).findById(c.clientId);
  if (!client?.email) return false;
  const settings = await StudioSettingsModel.current(trx);
  const garments = await CommissionModel.relatedQuery('garments', trx).for(c.id).orderBy('garments.id');
  const states = await custodyStates(garments.map((g) => g.id), trx);
  const comesBack = garments
    .map((g) => ({ g, custody: states.get(g.id)! }))
    .filter(({ custody }) => custody.state.status !== 'withdrawn')
    .map(({ g, custody }) => whatComesBack(g, custodyEnding(custody.events.map(toCustodyEvent))));
  const mail = deliveredMail({ clientName: client.name, studioName: settings.studioName, title: c.title, comesBack, link: `${appUrl}/portal/${c.id}` });
  await enqueueMail(trx, { kind: 'delivered', to: client.email, ...mail, commissionId: c.id, attachments: [{ filename: card.fileName, contentType: 'application/pdf', content: card.pdf }] });
  return true;
}

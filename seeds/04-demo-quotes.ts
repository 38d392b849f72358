import type { Knex } from 'knex';
import { cautionsFor, quoteTotals } from '@keepstitch/shared';
import { quotePdf } from '../server/quotes/quote-pdf';
import { DEMO_ACCOUNTS, DEMO_STUDIO } from './demo/accounts';

interface Line {
  kind: 'material' | 'labour' | 'extra' | 'discount';
  description: string;
  quantity: string;
  unit: string;
  unitPricePence: number;
  stage?: string;
}

const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

/**
 * The demo studio's settings, an accepted and deposit-paid quote for the
 * memory quilt, and a quote sent for the cushions that waits for the client's
 * answer (its e-mail sits in the outbox and goes to the local mail server).
 */
export async function seed(knex: Knex): Promise<void> {
  await knex('studio_settings')
    .where('id', 1)
    .update({
      studio_name: DEMO_STUDIO,
      maker_name: DEMO_ACCOUNTS.owner.name,
      address: 'The Loft, 3 Bobbin Yard\nThistlecombe',
      email: 'hello@larkspur.test',
      hourly_rate_pence: 2800,
      vat_registered: false,
      vat_rate: '20',
      vat_mode: 'line',
      deposit_percent: '30',
      validity_days: 30,
      payment_terms: 'A 30% deposit books your commission into the workroom diary. The balance is due before delivery. Garments are returned with the finished piece.',
      block_minutes: JSON.stringify({ square: 6, rectangles: 6, hst: 12, qst: 15, 'flying-geese': 14, foundation: 25, plate: 90, fan: 45 }),
    });
  const settings = { vatRate: null, vatMode: 'line' as const, depositPercent: '30' };

  const commissions = await knex('commissions').select('id', 'title', 'clientId');
  const owner = await knex('users').where('email', DEMO_ACCOUNTS.owner.email).first();
  const quilt = commissions.find((c) => c.title === 'Work-shirt memory quilt');
  const cushions = commissions.find((c) => c.title.startsWith('Two cushions'));

  async function addQuote(commissionId: number, lines: Line[], state: { status: 'sent' | 'accepted'; sentDaysAgo: number; acceptedName?: string }) {
    const totals = quoteTotals({ lines, ...settings });
    const sentAt = new Date(Date.now() - state.sentDaysAgo * 86_400_000);
    const [quote] = await knex('quotes')
      .insert({
        commissionId,
        version: 1,
        status: 'draft',
        intro: 'Thank you for trusting us with these clothes. Here is what making your piece involves.',
        depositPercent: settings.depositPercent,
        vatRate: settings.vatRate,
        vatMode: settings.vatMode,
        createdBy: owner.id,
      })
      .returning('id');
    await knex('quoteLines').insert(lines.map((l, position) => ({ quoteId: quote.id, position, ...l, quantity: l.quantity, unitPricePence: String(l.unitPricePence), stage: l.stage ?? null })));
    await knex('quotes')
      .where('id', quote.id)
      .update({
        status: state.status,
        sentAt,
        validUntil: day(30 - state.sentDaysAgo),
        netPence: totals.netPence,
        vatPence: totals.vatPence,
        totalPence: totals.totalPence,
        depositPence: totals.depositPence,
        studioSnapshot: JSON.stringify({ name: DEMO_STUDIO, address: 'The Loft, 3 Bobbin Yard\nThistlecombe', email: 'hello@larkspur.test', vatNumber: null, paymentTerms: 'A 30% deposit books your commission into the workroom diary. The balance is due before delivery.' }),
        ...(state.status === 'accepted' ? { acceptedAt: new Date(sentAt.getTime() + 2 * 86_400_000), acceptedName: state.acceptedName } : {}),
      });
    return { id: quote.id as number, totals };
  }

  if (quilt) {
    const q = await addQuote(
      quilt.id,
      [
        { kind: 'labour', description: 'Preparation: unpicking, washing, pressing, stabilising the knit', quantity: '4', unit: 'hours', unitPricePence: 2800, stage: 'preparation' },
        { kind: 'labour', description: 'Cutting and piecing the top', quantity: '14', unit: 'hours', unitPricePence: 2800, stage: 'piecing' },
        { kind: 'labour', description: 'Quilting, binding and label', quantity: '7.5', unit: 'hours', unitPricePence: 2800, stage: 'quilting' },
        { kind: 'material', description: 'Wide backing, unbleached calico', quantity: '2.6', unit: 'm', unitPricePence: 1450 },
        { kind: 'material', description: 'Cotton wadding 80/20', quantity: '2.75', unit: 'yd', unitPricePence: 1100 },
        { kind: 'material', description: 'Navy binding and sashing cotton', quantity: '1.2', unit: 'm', unitPricePence: 1200 },
        { kind: 'extra', description: 'Embroidered label with his name and dates', quantity: '1', unit: 'item', unitPricePence: 1800 },
      ],
      { status: 'accepted', sentDaysAgo: 26, acceptedName: DEMO_ACCOUNTS.clientA.name },
    );
    await knex('payments').insert({
      commissionId: quilt.id,
      quoteId: q.id,
      kind: 'deposit',
      amountPence: q.totals.depositPence,
      status: 'paid',
      checkoutSessionId: 'cs_demo_deposit_quilt',
      paymentIntentId: 'pi_demo_deposit_quilt',
      paidAt: new Date(Date.now() - 23 * 86_400_000),
      // A payment that counts has a numbered receipt.
      receiptNumber: knex.raw(`nextval('payment_receipt_numbers')`),
    });
  }

  if (cushions && cushions.clientId) {
    await knex('commissions').where('id', cushions.id).update({ stage: 'quoted' });
    await knex('stageMoves').where({ commissionId: cushions.id, toStage: 'booked' }).delete();
    await knex('stageMoves').insert({ commissionId: cushions.id, fromStage: 'enquiry', toStage: 'quoted', movedBy: owner.id, note: 'Quote version 1 sent' });
    const q = await addQuote(
      cushions.id,
      [
        { kind: 'labour', description: 'Two 16 in cushion covers, pieced from the dresses', quantity: '6', unit: 'hours', unitPricePence: 2800, stage: 'piecing' },
        { kind: 'material', description: 'Cushion pads 16 in, feather-free', quantity: '2', unit: 'pads', unitPricePence: 850 },
        { kind: 'material', description: 'Fusible interfacing for the lawn', quantity: '0.5', unit: 'm', unitPricePence: 900 },
        { kind: 'extra', description: 'Buttons removed; embroidered names instead (for a child under 3)', quantity: '2', unit: 'items', unitPricePence: 1200 },
      ],
      { status: 'sent', sentDaysAgo: 1 },
    );
    const client = await knex('clients').where('id', cushions.clientId).first();
    const commission = await knex('commissions').where('id', cushions.id).first();
    const lines = await knex('quoteLines').where('quoteId', q.id).orderBy('position');
    const pdf = await quotePdf({
      studio: { name: DEMO_STUDIO, address: 'The Loft, 3 Bobbin Yard\nThistlecombe', email: 'hello@larkspur.test', vatNumber: null, paymentTerms: 'A 30% deposit books your commission into the workroom diary. The balance is due before delivery.' },
      client: { name: client.name, address: client.address },
      commission: { title: cushions.title, id: cushions.id },
      quote: { version: 1, sentAt: new Date(Date.now() - 86_400_000), validUntil: day(29), intro: null, vatRate: null, depositPercent: '30' },
      lines: lines.map((l, i) => ({ description: l.description, quantity: l.quantity, unit: l.unit, unitPricePence: l.unitPricePence, netPence: q.totals.lineNetPence[i]!, vatPence: 0 })),
      totals: q.totals,
      vatMode: 'line',
      cautions: cautionsFor(commission.ageGroup),
    });
    if (client?.email) {
      await knex('outboxMails').insert({
        kind: 'quote',
        toAddress: client.email,
        subject: `Your quote from ${DEMO_STUDIO}: ${cushions.title}`,
        textBody: `Dear ${client.name},\n\nYour quote for "${cushions.title}" (version 1) is ready: the total is £${(q.totals.totalPence / 100).toFixed(2)}. You can accept it and pay the deposit on your page.\n`,
        htmlBody: `<p>Dear ${client.name},</p><p>Your quote for \u201c${cushions.title}\u201d (version 1) is ready.</p>`,
        attachments: JSON.stringify([{ filename: `quote-${cushions.id}-v1.pdf`, contentType: 'application/pdf', content: pdf.toString('base64') }]),
        commissionId: cushions.id,
      });
    }
  }
}

import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import type { AppConfig } from '../core/config';
import { acceptSchema, declineSchema, quoteSchema } from './quotes-schemas';
import * as quotes from './quotes-service';

export function quotesRouter(config: AppConfig, kickMail: () => void) {
  const commissionQuotes = securedRouter('/api/commissions');
  commissionQuotes.get('/:id/quotes', async (req, res) => {
    res.json({ items: await quotes.listQuotes(signedInUser(req), parseId(req.params['id'], 'That commission')) });
  });
  commissionQuotes.get('/:id/quote-suggestion', async (req, res) => {
    res.json(await quotes.suggestLines(signedInUser(req), parseId(req.params['id'], 'That commission')));
  });
  commissionQuotes.post('/:id/quotes', async (req, res) => {
    const id = parseId(req.params['id'], 'That commission');
    res.status(201).json(await quotes.createQuote(signedInUser(req), id, parseInput(quoteSchema, req.body, 'quote')));
  });

  const r = securedRouter('/api/quotes');
  r.get('/:id', async (req, res) => {
    res.json(await quotes.getQuote(signedInUser(req), parseId(req.params['id'], 'That quote')));
  });
  r.put('/:id', async (req, res) => {
    const id = parseId(req.params['id'], 'That quote');
    res.json(await quotes.updateQuote(signedInUser(req), id, parseInput(quoteSchema, req.body, 'quote')));
  });
  r.get('/:id/pdf', async (req, res) => {
    const { pdf, fileName } = await quotes.quotePdfFor(signedInUser(req), parseId(req.params['id'], 'That quote'));
    res.type('application/pdf').setHeader('Content-Disposition', `inline; filename="${fileName}"`);
    res.send(pdf);
  });
  r.post('/:id/send', async (req, res) => {
    const sent = await quotes.sendQuote(signedInUser(req), parseId(req.params['id'], 'That quote'), config);
    kickMail();
    res.json(sent);
  });
  r.post('/:id/accept', async (req, res) => {
    const { name } = parseInput(acceptSchema, req.body, 'acceptance');
    res.json(await quotes.acceptQuote(signedInUser(req), parseId(req.params['id'], 'That quote'), name));
  });
  r.post('/:id/decline', async (req, res) => {
    const { note } = parseInput(declineSchema, req.body, 'reply');
    res.json(await quotes.declineQuote(signedInUser(req), parseId(req.params['id'], 'That quote'), note));
  });
  return [commissionQuotes.router, r.router];
}

import type { Response } from 'express';
import { securedRouter } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { clientResponseSchema, designBodySchema, paperSchema, saveDesignSchema } from './designs-schemas';
import * as designs from './designs-service';
import type { DesignBody } from '@keepstitch/shared';
import { cutListPdf } from './printouts/cut-list-pdf';
import { sewingOrderPdf } from './printouts/sewing-order-pdf';
import { templatesPdf } from './printouts/templates-pdf';
import { careCardPdf } from './printouts/care-card-pdf';

const WHAT = 'That commission';

function sendPdf(res: Response, name: string, pdf: Buffer): void {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${name}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(pdf);
}

/** A commission's design, its versions, the client's review and the workroom printouts. */
export function designsRouter() {
  const r = securedRouter('/api/commissions');
  const idOf = (v: unknown) => parseId(v, WHAT);

  r.get('/:id/design', async (req, res) => {
    res.json(await designs.getDesign(req.user!, idOf(req.params['id'])));
  });
  r.get('/:id/design/versions/:version', async (req, res) => {
    res.json(await designs.getVersion(req.user!, idOf(req.params['id']), parseId(req.params['version'], 'That design version')));
  });
  r.post('/:id/design', async (req, res) => {
    const id = idOf(req.params['id']);
    const { body, note } = parseInput(saveDesignSchema, req.body, 'design');
    res.status(201).json(await designs.saveDesign(req.user!, id, body as DesignBody, note));
  });
  r.post('/:id/design/preview', async (req, res) => {
    const id = idOf(req.params['id']);
    const body = parseInput(designBodySchema, req.body, 'design');
    res.json(await designs.previewDesign(req.user!, id, body as DesignBody));
  });
  r.post('/:id/design/share', async (req, res) => {
    res.json(await designs.shareDesign(req.user!, idOf(req.params['id'])));
  });
  r.get('/:id/design/shared', async (req, res) => {
    res.json(await designs.sharedDesign(req.user!, idOf(req.params['id'])));
  });
  r.post('/:id/design/response', async (req, res) => {
    const id = idOf(req.params['id']);
    const { response, note } = parseInput(clientResponseSchema, req.body, 'answer');
    res.json(await designs.respondToDesign(req.user!, id, response, note));
  });
  r.get('/:id/design/cut-list.pdf', async (req, res) => {
    const p = await designs.printable(req.user!, idOf(req.params['id']));
    sendPdf(res, `cut-list-${p.commission.id}-v${p.version.version}.pdf`, await cutListPdf(p));
  });
  r.get('/:id/design/sewing-order.pdf', async (req, res) => {
    const p = await designs.printable(req.user!, idOf(req.params['id']));
    sendPdf(res, `sewing-order-${p.commission.id}-v${p.version.version}.pdf`, await sewingOrderPdf(p));
  });
  r.get('/:id/design/templates.pdf', async (req, res) => {
    const { paper } = parseInput(paperSchema, req.query, 'printout request');
    const p = await designs.printable(req.user!, idOf(req.params['id']));
    sendPdf(res, `templates-${p.commission.id}-v${p.version.version}-${paper}.pdf`, await templatesPdf(p, paper));
  });
  r.get('/:id/care-card', async (req, res) => {
    res.json(await designs.careCard(req.user!, idOf(req.params['id'])));
  });
  r.get('/:id/care-card.pdf', async (req, res) => {
    const card = await designs.careCard(req.user!, idOf(req.params['id']));
    sendPdf(res, `care-card-${card.commission.id}.pdf`, await careCardPdf(card));
  });
  return r.router;
}

import type { Response } from 'express';
import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { clientResponseSchema, designBodySchema, paperSchema, saveDesignSchema } from './designs-schemas';
import * as designs from './designs-service';
import { PRINTOUTS, buildPrintout, printoutFileName, printoutPdfPath, type DesignBody, type PrintoutSource, type PrintoutSources } from '@keepstitch/shared';
import { today } from '../core/calendar';
import { printoutPdf } from './printouts/printout-pdf';

const WHAT = 'That commission';

function sendPdf(res: Response, name: string, pdf: Buffer): void {
  res.setHeader('Content-Type', 'application/pdf');
  res.setHeader('Content-Disposition', `inline; filename="${name}"`);
  res.setHeader('Cache-Control', 'no-store');
  res.send(pdf);
}

/** What each kind of printout is drawn from, read for the caller. */
const PRINTOUT_DATA: { [S in PrintoutSource]: (user: Express.User, commissionId: number) => Promise<PrintoutSources[S]> } = {
  design: designs.printable,
  'care-card': designs.careCard,
};

/** A commission's design, its versions, the client's review and the workroom printouts. */
export function designsRouter() {
  const r = securedRouter('/api/commissions');
  const idOf = (v: unknown) => parseId(v, WHAT);

  r.get('/:id/design', async (req, res) => {
    res.json(await designs.getDesign(signedInUser(req), idOf(req.params['id'])));
  });
  r.get('/:id/design/versions/:version', async (req, res) => {
    res.json(await designs.getVersion(signedInUser(req), idOf(req.params['id']), parseId(req.params['version'], 'That design version')));
  });
  r.post('/:id/design', async (req, res) => {
    const id = idOf(req.params['id']);
    const { body, note } = parseInput(saveDesignSchema, req.body, 'design');
    res.status(201).json(await designs.saveDesign(signedInUser(req), id, body as DesignBody, note));
  });
  r.post('/:id/design/preview', async (req, res) => {
    const id = idOf(req.params['id']);
    const body = parseInput(designBodySchema, req.body, 'design');
    res.json(await designs.previewDesign(signedInUser(req), id, body as DesignBody));
  });
  r.post('/:id/design/share', async (req, res) => {
    res.json(await designs.shareDesign(signedInUser(req), idOf(req.params['id'])));
  });
  r.get('/:id/design/shared', async (req, res) => {
    res.json(await designs.sharedDesign(signedInUser(req), idOf(req.params['id'])));
  });
  r.post('/:id/design/response', async (req, res) => {
    const id = idOf(req.params['id']);
    const { response, note } = parseInput(clientResponseSchema, req.body, 'answer');
    res.json(await designs.respondToDesign(signedInUser(req), id, response, note));
  });
  r.get('/:id/care-card', async (req, res) => {
    res.json(await designs.careCard(signedInUser(req), idOf(req.params['id'])));
  });
  // Every printout's PDF, from the printouts' registry.
  for (const p of PRINTOUTS) {
    r.get(`/:id${printoutPdfPath(p)}`, async (req, res) => {
      const paper = p.papers ? parseInput(paperSchema, req.query, 'printout request').paper : undefined;
      const data = await PRINTOUT_DATA[p.source](signedInUser(req), idOf(req.params['id']));
      const content = buildPrintout(p, data, { printedOn: today(), ...(paper ? { paper } : {}) });
      sendPdf(res, printoutFileName(p, data, paper), await printoutPdf(content, { documentTitle: `${p.title}: ${data.commission.title}`, ...(paper ? { paper } : {}) }));
    });
  }
  return r.router;
}

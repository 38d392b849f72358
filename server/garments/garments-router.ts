import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { custodyEventSchema, panelSchema, updateGarmentSchema, updatePanelSchema } from './garments-schemas';
import * as garments from './garments-service';

export function garmentsRouter() {
  const commissionGarments = securedRouter('/api/commissions');
  commissionGarments.post('/:id/garments', async (req, res) => {
    const commissionId = parseId(req.params['id'], 'That commission');
    res.status(201).json(await garments.createGarment(signedInUser(req), commissionId, req.body));
  });

  const r = securedRouter('/api/garments');
  r.get('/:id', async (req, res) => {
    res.json(await garments.getGarment(signedInUser(req), parseId(req.params['id'], 'That garment')));
  });
  r.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], 'That garment');
    res.json(await garments.updateGarment(signedInUser(req), id, parseInput(updateGarmentSchema, req.body, 'garment')));
  });
  r.post('/:id/events', async (req, res) => {
    const id = parseId(req.params['id'], 'That garment');
    res.status(201).json(await garments.addCustodyEvent(signedInUser(req), id, parseInput(custodyEventSchema, req.body, 'custody event')));
  });
  r.post('/:id/panels', async (req, res) => {
    const id = parseId(req.params['id'], 'That garment');
    res.status(201).json(await garments.addPanel(signedInUser(req), id, parseInput(panelSchema, req.body, 'panel')));
  });

  const panels = securedRouter('/api/panels');
  panels.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], 'That panel');
    res.json(await garments.updatePanel(signedInUser(req), id, parseInput(updatePanelSchema, req.body, 'panel')));
  });
  panels.delete('/:id', async (req, res) => {
    await garments.deletePanel(signedInUser(req), parseId(req.params['id'], 'That panel'));
    res.status(204).end();
  });

  return [commissionGarments.router, r.router, panels.router];
}

import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { createClientSchema, listClientsQuerySchema, updateClientSchema } from './clients-schemas';
import * as clients from './clients-service';

export function clientsRouter() {
  const r = securedRouter('/api/clients');

  r.get('/', async (req, res) => {
    const query = parseInput(listClientsQuerySchema, req.query, 'list request');
    res.json(await clients.listClients(signedInUser(req), query));
  });

  r.post('/', async (req, res) => {
    const input = parseInput(createClientSchema, req.body, 'client');
    res.status(201).json(await clients.createClient(signedInUser(req), input));
  });

  r.get('/:id', async (req, res) => {
    res.json(await clients.getClient(signedInUser(req), parseId(req.params['id'], 'That client')));
  });

  // The client's page: their commissions, quotes and payments.
  r.get('/:id/record', async (req, res) => {
    res.json(await clients.clientRecord(signedInUser(req), parseId(req.params['id'], 'That client')));
  });

  r.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], 'That client');
    const input = parseInput(updateClientSchema, req.body, 'client');
    res.json(await clients.updateClient(signedInUser(req), id, input));
  });

  r.delete('/:id', async (req, res) => {
    await clients.deleteClient(parseId(req.params['id'], 'That client'));
    res.status(204).end();
  });

  return r.router;
}

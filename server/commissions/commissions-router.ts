import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { createCommissionSchema, hoursSchema, listCommissionsQuerySchema, updateCommissionSchema } from './commissions-schemas';
import * as commissions from './commissions-service';

const WHAT = 'That commission';

export function commissionsRouter() {
  const r = securedRouter('/api/commissions');

  r.get('/', async (req, res) => {
    const query = parseInput(listCommissionsQuerySchema, req.query, 'list request');
    res.json(await commissions.listCommissions(signedInUser(req), query));
  });

  r.post('/', async (req, res) => {
    const input = parseInput(createCommissionSchema, req.body, 'commission');
    res.status(201).json(await commissions.createCommission(signedInUser(req), input));
  });

  r.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const input = parseInput(updateCommissionSchema, req.body, 'commission');
    res.json(await commissions.updateCommission(signedInUser(req), id, input));
  });

  r.post('/:id/hours', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const input = parseInput(hoursSchema, req.body, 'hours');
    res.status(201).json(await commissions.logHours(signedInUser(req), id, input));
  });

  return r.router;
}

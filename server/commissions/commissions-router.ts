import { securedRouter } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { createCommissionSchema, hoursSchema, listCommissionsQuerySchema, stageMoveSchema, updateCommissionSchema } from './commissions-schemas';
import * as commissions from './commissions-service';
import type { Stage } from '@keepstitch/shared';
import type { AppConfig } from '../core/config';

const WHAT = 'That commission';

export function commissionsRouter(config: AppConfig, kickMail: () => void) {
  const r = securedRouter('/api/commissions');

  r.get('/', async (req, res) => {
    const query = parseInput(listCommissionsQuerySchema, req.query, 'list request');
    res.json(await commissions.listCommissions(req.user!, query));
  });

  r.post('/', async (req, res) => {
    const input = parseInput(createCommissionSchema, req.body, 'commission');
    res.status(201).json(await commissions.createCommission(req.user!, input));
  });

  r.get('/:id', async (req, res) => {
    res.json(await commissions.getCommission(req.user!, parseId(req.params['id'], WHAT)));
  });

  r.patch('/:id', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const input = parseInput(updateCommissionSchema, req.body, 'commission');
    res.json(await commissions.updateCommission(req.user!, id, input));
  });

  r.post('/:id/stage', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const { to, note } = parseInput(stageMoveSchema, req.body, 'stage move');
    const moved = await commissions.moveStage(req.user!, id, to as Stage, note, config.appUrl);
    if (moved.mailed) kickMail();
    res.json({ id: moved.id, stage: moved.stage, nextStages: moved.nextStages });
  });

  r.post('/:id/hours', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const input = parseInput(hoursSchema, req.body, 'hours');
    res.status(201).json(await commissions.logHours(req.user!, id, input));
  });

  return r.router;
}

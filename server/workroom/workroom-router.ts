import type { Stage } from '@keepstitch/shared';
import type { AppConfig } from '../core/config';
import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId, parseInput } from '../core/validate';
import { stageMoveSchema } from '../commissions/commissions-schemas';
import { getCommission } from './commission-page';
import { moveStage } from './stage-move';

const WHAT = 'That commission';

/** The commission page (everything it shows, read together) and the stage move. */
export function workroomRouter(config: AppConfig, kickMail: () => void) {
  const r = securedRouter('/api/commissions');

  r.get('/:id', async (req, res) => {
    res.json(await getCommission(signedInUser(req), parseId(req.params['id'], WHAT)));
  });

  r.post('/:id/stage', async (req, res) => {
    const id = parseId(req.params['id'], WHAT);
    const { to, note } = parseInput(stageMoveSchema, req.body, 'stage move');
    const moved = await moveStage(signedInUser(req), id, to as Stage, note, config.appUrl);
    if (moved.mailed) kickMail();
    res.json({ id: moved.id, stage: moved.stage, nextStages: moved.nextStages, stageOptions: moved.stageOptions });
  });

  return r.router;
}

import { securedRouter, signedInUser } from '../core/secured-router';
import { parseId } from '../core/validate';
import { getClient } from '../clients/clients-service';
import { inviteClient } from './invitations';

/** The owner invites a client to their page (again, when the first link was lost or ran out). */
export function invitationsRouter(appUrl: string, kickMail: () => void) {
  const r = securedRouter('/api/clients');
  r.post('/:id/invitation', async (req, res) => {
    const id = parseId(req.params['id'], 'That client');
    await inviteClient(id, appUrl);
    kickMail();
    res.json(await getClient(signedInUser(req), id));
  });
  return r.router;
}

import { AppError } from '../core/app-error';
import type { AppConfig } from '../core/config';
import { securedRouter } from '../core/secured-router';
import { parseId } from '../core/validate';
import { retryMail, undelivered } from './outbox-service';

export function mailRouter(config: AppConfig, kickMail: () => void) {
  const r = securedRouter('/api/mail');
  /** Mails not delivered yet: pending (being retried) or failed. */
  r.get('/outbox', async (_req, res) => {
    res.json({ items: await undelivered() });
  });
  r.post('/outbox/:id/retry', async (req, res) => {
    if (!(await retryMail(parseId(req.params['id'], 'That mail')))) throw AppError.notFound('That mail');
    kickMail();
    res.status(204).end();
  });
  /** What the local fake mail server received (development only). */
  r.get('/sent', async (_req, res) => {
    if (!config.fakeMailApi) throw new AppError(404, 'not_found', 'The sent-mail list is only kept by the local development mail server.');
    const answer = await fetch(`${config.fakeMailApi}/messages`).catch(() => null);
    if (!answer?.ok) throw new AppError(503, 'unavailable', 'The local mail server is not answering.');
    const body = (await answer.json()) as { items: Array<Record<string, unknown>> };
    res.json({ items: body.items.map((m) => ({ ...m, attachments: (m['attachments'] as Array<Record<string, unknown>>).map((a, i) => ({ ...a, url: `/api/mail/sent/${m['id'] as number}/attachments/${i}` })) })) });
  });
  r.get('/sent/:id/attachments/:n', async (req, res) => {
    if (!config.fakeMailApi) throw AppError.notFound('That attachment');
    const id = parseId(req.params['id'], 'That mail');
    const n = Number(req.params['n']);
    if (!Number.isInteger(n) || n < 0 || n > 100) throw AppError.notFound('That attachment');
    const answer = await fetch(`${config.fakeMailApi}/messages/${id}/attachments/${n}`).catch(() => null);
    if (!answer?.ok) throw AppError.notFound('That attachment');
    res.type(answer.headers.get('content-type') ?? 'application/octet-stream');
    res.setHeader('Content-Disposition', answer.headers.get('content-disposition') ?? 'attachment');
    res.send(Buffer.from(await answer.arrayBuffer()));
  });
  return r.router;
}

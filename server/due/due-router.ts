import { AppError } from '../core/app-error';
import { securedRouter, signedInUser } from '../core/secured-router';
import { isCalendarFeedSecret } from '../settings/calendar-feed-secret';
import { deadlinesCalendar } from './calendar-feed';
import { overviewFor } from './overview';

/** A feed secret as made (32 random bytes, base64url), optionally ending in .ics as calendar apps like. */
const FEED_SECRET = /^([A-Za-z0-9_-]{43})(\.ics)?$/;

/** What is due: the overview page and the calendar feed of deadlines. */
export function dueRouter(appUrl: string) {
  const overview = securedRouter('/api/overview');
  overview.get('/', async (req, res) => {
    res.json(await overviewFor(signedInUser(req).role));
  });

  // Read by calendar apps, which cannot sign in: the secret in the address is the key.
  const calendar = securedRouter('/api/calendar');
  calendar.get('/:secret', async (req, res) => {
    const secret = FEED_SECRET.exec(String(req.params['secret']))?.[1];
    if (!secret || !(await isCalendarFeedSecret(secret))) throw AppError.notFound('That calendar');
    res.type('text/calendar; charset=utf-8');
    res.setHeader('Cache-Control', 'private, max-age=300');
    res.send(await deadlinesCalendar(appUrl));
  });
  return [overview.router, calendar.router];
}

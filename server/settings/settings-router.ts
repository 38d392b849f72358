import { z } from 'zod';
import { SETTINGS_TEXT_LIMITS as L, STUDIO_LOCALES, VAT_RATES } from '@keepstitch/shared';
import type { AppConfig } from '../core/config';
import { securedRouter } from '../core/secured-router';
import { optionalText, parseInput } from '../core/validate';
import { StudioSettingsModel } from '../models/settings-model';
import { calendarFeedUrl, makeCalendarFeedSecret, stopCalendarFeed } from './calendar-feed-secret';

export const settingsSchema = z
  .object({
    studioName: z.string().trim().min(1, 'Give the studio a name.').max(L.studioName, `A studio name can be at most ${L.studioName} characters.`),
    makerName: z.string().trim().max(L.makerName, `A name can be at most ${L.makerName} characters.`),
    address: z.string().trim().max(L.address, `An address can be at most ${L.address} characters.`),
    email: optionalText(L.email, 'E-mail'),
    hourlyRatePence: z.number({ message: 'Hourly rate must be an amount in pence.' }).int().min(0, 'The hourly rate cannot be negative.').max(100_000),
    vatRegistered: z.boolean({ message: 'Say whether the studio is VAT registered.' }),
    vatRate: z.enum(VAT_RATES, { message: 'VAT rate must be 20, 5 or 0.' }),
    vatMode: z.enum(['line', 'invoice'], { message: 'Work VAT per line or on the total.' }),
    vatNumber: optionalText(L.vatNumber, 'VAT number'),
    depositPercent: z.number({ message: 'Deposit must be a percentage.' }).min(0, 'Deposit must be 0 to 100 percent.').max(100, 'Deposit must be 0 to 100 percent.'),
    validityDays: z.number({ message: 'Validity must be a number of days.' }).int().min(1, 'A quote is valid for at least a day.').max(365, 'At most 365 days.'),
    paymentTerms: z.string().trim().max(L.paymentTerms, `Payment terms can be at most ${L.paymentTerms} characters.`),
    blockMinutes: z.record(z.string().max(40), z.number().min(0).max(10_000)),
    remindQuoteExpiry: z.boolean({ message: 'Say whether to remind clients of a quote about to run out.' }),
    remindBalanceDue: z.boolean({ message: 'Say whether to remind clients of a balance due before delivery.' }),
    remindGarmentsLate: z.boolean({ message: 'Say whether to remind clients of garments not yet arrived.' }),
    garmentsLateDays: z.number({ message: 'Days before a garment reminder must be a whole number of days.' }).int('Days before a garment reminder must be a whole number of days.').min(1, 'Remind after at least 1 day.').max(365, 'Remind after at most 365 days.'),
    locale: z.enum(STUDIO_LOCALES, { message: `Pick the studio locale from the list: ${STUDIO_LOCALES.join(', ')}.` }),
  })
  .partial()
  .strict();

export function settingsRouter(config: Pick<AppConfig, 'appUrl'>) {
  const r = securedRouter('/api/settings');
  r.get('/', async (_req, res) => {
    res.json(await StudioSettingsModel.current());
  });
  // Every signed-in page that shows a date field types it in the studio's order.
  r.get('/locale', async (_req, res) => {
    res.json({ locale: (await StudioSettingsModel.current()).locale });
  });
  r.patch('/', async (req, res) => {
    const input = parseInput(settingsSchema, req.body, 'settings');
    const patch = { ...input, ...(input.depositPercent !== undefined ? { depositPercent: String(input.depositPercent) } : {}), updatedAt: new Date() };
    res.json(await StudioSettingsModel.query().patchAndFetchById(1, patch as Partial<StudioSettingsModel>));
  });
  /** A new address for the calendar feed, shown this once; the one before stops working. */
  r.post('/calendar-feed', async (_req, res) => {
    const { secret, madeAt } = await makeCalendarFeedSecret();
    res.status(201).json({ url: calendarFeedUrl(config.appUrl, secret), madeAt });
  });
  /** Turns the calendar feed off. */
  r.delete('/calendar-feed', async (_req, res) => {
    await stopCalendarFeed();
    res.status(204).end();
  });
  return r.router;
}

// The studio's locale: the order a date is typed and shown in on the forms
// (day first in en-GB, month first in en-US, year first in en-CA and ja-JP),
// and later the way numbers are written.

export const STUDIO_LOCALES = ['en-GB', 'en-US', 'en-IE', 'en-CA', 'ja-JP'] as const;
export type StudioLocale = (typeof STUDIO_LOCALES)[number];

export const DEFAULT_STUDIO_LOCALE: StudioLocale = 'en-GB';

/** The settings page's name for each locale, with the date order it brings. */
export const STUDIO_LOCALE_LABELS: Readonly<Record<StudioLocale, string>> = {
  'en-GB': 'English (UK): 31/12/2026',
  'en-US': 'English (US): 12/31/2026',
  'en-IE': 'English (Ireland): 31/12/2026',
  'en-CA': 'English (Canada): 2026-12-31',
  'ja-JP': 'Japanese (Japan): 2026/12/31',
};

export function isStudioLocale(value: unknown): value is StudioLocale {
  return (STUDIO_LOCALES as readonly unknown[]).includes(value);
}

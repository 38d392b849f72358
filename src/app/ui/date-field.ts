import { ChangeDetectionStrategy, Component, Injectable, Provider, computed, effect, inject, input, signal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';
import { DateFnsAdapter, MAT_DATE_FNS_FORMATS } from '@angular/material-date-fns-adapter';
import { DateAdapter, MAT_DATE_FORMATS, MAT_DATE_LOCALE, MatDateFormats } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { DATE_YEARS, DEFAULT_STUDIO_LOCALE, isStudioLocale, type StudioLocale } from '@keepstitch/shared';
import { type Locale, isValid, parse } from 'date-fns';
import { enCA, enGB, enIE, enUS, ja } from 'date-fns/locale';

import { CurrentLocale } from '../core/current-locale';

/**
 * Material's datepicker on the forms' date fields, in the studio's locale.
 * The form controls hold the API's own `YYYY-MM-DD` text, never a `Date`: a
 * deadline keeps its calendar day in every time zone, and the form sends what
 * it holds. Calendar work (month names, weeks, adding months) is date-fns's,
 * through Material's date-fns adapter, on a local-midnight `Date` made from the
 * text's own year, month and day and read back the same way.
 *
 * A component with a date field imports `DATE_FIELD` and adds
 * `provideDateField()` to its providers (so the datepicker and date-fns stay
 * out of the first load):
 *
 *   <mat-form-field>
 *     <mat-label>Deadline</mat-label>
 *     <input matInput [matDatepicker]="deadlinePicker" formControlName="deadline" />
 *     <mat-datepicker-toggle matIconSuffix [for]="deadlinePicker" />
 *     <mat-datepicker #deadlinePicker />
 *     <mat-hint>{{ dates.pattern() }}</mat-hint>
 *     <mat-error [ksDateErrorOf]="form.controls.deadline" />
 *   </mat-form-field>
 */

const DATE_FNS_LOCALES: Readonly<Record<StudioLocale, Locale>> = { 'en-GB': enGB, 'en-US': enUS, 'en-IE': enIE, 'en-CA': enCA, 'ja-JP': ja };

/** The studio's locale as one of the offered ones; anything else (an old or unknown value) as the default. */
export function knownLocale(locale: string): StudioLocale {
  return isStudioLocale(locale) ? locale : DEFAULT_STUDIO_LOCALE;
}

/** How a date is typed in a locale: "DD/MM/YYYY" (en-GB), "MM/DD/YYYY" (en-US), "YYYY-MM-DD" (en-CA), "YYYY/MM/DD" (ja-JP). */
export function typedDatePattern(locale: StudioLocale): string {
  const pattern = DATE_FNS_LOCALES[locale].formatLong?.date({ width: 'short' }) ?? 'dd/MM/yyyy';
  return pattern.replace(/y+/g, 'YYYY').replace(/M+/g, 'MM').replace(/d+/g, 'DD');
}

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
/** What `invalid()` gives: text a person typed that is not a date. */
const NOT_A_DATE = 'not a date';

/** The date's own day at local midnight, so date-fns's local calendar reads the same year, month and day. */
function localDate(iso: string): Date {
  const [, y, m, d] = ISO_DATE.exec(iso)!;
  const date = new Date(0);
  date.setFullYear(Number(y), Number(m) - 1, Number(d));
  date.setHours(0, 0, 0, 0);
  return date;
}

/** A `Date`'s local calendar day as `YYYY-MM-DD` (never through UTC, which moves it in any zone off Greenwich). */
function isoOf(date: Date): string {
  const pad = (n: number, width = 2) => String(n).padStart(width, '0');
  return `${pad(date.getFullYear(), 4)}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** `YYYY-MM-DD` that names a day that exists, in the years the server keeps. */
function isRealIsoDate(value: string): boolean {
  if (!ISO_DATE.test(value)) return false;
  const year = Number(value.slice(0, 4));
  return year >= DATE_YEARS.min && year <= DATE_YEARS.max && isoOf(localDate(value)) === value;
}

/**
 * Material's date adapter over `YYYY-MM-DD` text. Its locale is the studio's:
 * set from `MAT_DATE_LOCALE` at first and following the setting after, which
 * re-draws every date field through `localeChanges`.
 */
@Injectable()
export class IsoDateAdapter extends DateAdapter<string, StudioLocale> {
  private readonly fns = new DateFnsAdapter();

  constructor() {
    super();
    const current = inject(CurrentLocale);
    this.setLocale(knownLocale(String(inject(MAT_DATE_LOCALE, { optional: true }) ?? current.locale())));
    effect(() => {
      const locale = knownLocale(current.locale());
      if (locale !== this.locale) this.setLocale(locale);
    });
  }

  override setLocale(locale: StudioLocale): void {
    this.fns.setLocale(DATE_FNS_LOCALES[locale]);
    super.setLocale(locale);
  }

  getYear(date: string): number {
    return Number(date.slice(0, 4));
  }
  getMonth(date: string): number {
    return Number(date.slice(5, 7)) - 1;
  }
  getDate(date: string): number {
    return Number(date.slice(8, 10));
  }
  getDayOfWeek(date: string): number {
    return this.fns.getDayOfWeek(localDate(date));
  }
  getMonthNames(style: 'long' | 'short' | 'narrow'): string[] {
    return this.fns.getMonthNames(style);
  }
  getDateNames(): string[] {
    return this.fns.getDateNames();
  }
  getDayOfWeekNames(style: 'long' | 'short' | 'narrow'): string[] {
    return this.fns.getDayOfWeekNames(style);
  }
  getYearName(date: string): string {
    return this.fns.getYearName(localDate(date));
  }
  getFirstDayOfWeek(): number {
    return this.fns.getFirstDayOfWeek();
  }
  getNumDaysInMonth(date: string): number {
    return this.fns.getNumDaysInMonth(localDate(date));
  }
  clone(date: string): string {
    return date;
  }
  createDate(year: number, month: number, date: number): string {
    return isoOf(this.fns.createDate(year, month, date));
  }
  today(): string {
    return isoOf(this.fns.today());
  }

  /**
   * Typed text in the locale's order ("03/12/2026" or "3/12/2026" in en-GB)
   * or as `YYYY-MM-DD`; empty as no date; anything else, a two-digit year or a
   * day that does not exist among them, as not a date.
   */
  parse(value: unknown, parseFormat: string | string[]): string | null {
    if (typeof value !== 'string') return null;
    const text = value.trim();
    if (!text) return null;
    if (ISO_DATE.test(text)) return isRealIsoDate(text) ? text : this.invalid();
    for (const format of Array.isArray(parseFormat) ? parseFormat : [parseFormat]) {
      const date = parse(text, format, new Date(), { locale: DATE_FNS_LOCALES[this.locale] });
      if (isValid(date)) return isRealIsoDate(isoOf(date)) ? isoOf(date) : this.invalid();
    }
    return this.invalid();
  }

  format(date: string, displayFormat: string): string {
    if (!this.isValid(date)) throw Error('IsoDateAdapter: cannot show a date that is not one.');
    return this.fns.format(localDate(date), displayFormat);
  }
  addCalendarYears(date: string, years: number): string {
    return isoOf(this.fns.addCalendarYears(localDate(date), years));
  }
  addCalendarMonths(date: string, months: number): string {
    return isoOf(this.fns.addCalendarMonths(localDate(date), months));
  }
  addCalendarDays(date: string, days: number): string {
    return isoOf(this.fns.addCalendarDays(localDate(date), days));
  }
  toIso8601(date: string): string {
    return date;
  }

  /** The API's `YYYY-MM-DD` as it is; empty text and null as no date; anything else as not a date. */
  override deserialize(value: unknown): string | null {
    if (value === null || value === undefined || value === '') return null;
    return typeof value === 'string' && isRealIsoDate(value) ? value : this.invalid();
  }
  isDateInstance(obj: unknown): obj is string {
    return typeof obj === 'string' && obj !== '';
  }
  isValid(date: string): boolean {
    return isRealIsoDate(date);
  }
  invalid(): string {
    return NOT_A_DATE;
  }
}

/** date-fns's formats, typed in the locale's short form ("P") or as YYYY-MM-DD. */
export const DATE_FIELD_FORMATS: MatDateFormats = {
  ...MAT_DATE_FNS_FORMATS,
  parse: { dateInput: ['P'] },
  display: { ...MAT_DATE_FNS_FORMATS.display, dateInput: 'P' },
};

/** The date fields' adapter, formats and locale, for the providers of a component that has one. */
export function provideDateField(): Provider[] {
  return [
    { provide: MAT_DATE_LOCALE, useFactory: () => knownLocale(inject(CurrentLocale).locale()) },
    { provide: DateAdapter, useClass: IsoDateAdapter },
    { provide: MAT_DATE_FORMATS, useValue: DATE_FIELD_FORMATS },
    DateFieldWords,
  ];
}

/** A date field's hint and messages in the studio's order ("DD/MM/YYYY"). */
@Injectable()
export class DateFieldWords {
  private readonly current = inject(CurrentLocale);
  readonly pattern = computed(() => typedDatePattern(knownLocale(this.current.locale())));
}

/**
 * The message under a date field: text that is not a date first (the field
 * is then also empty, so "required" would mislead), then the required text
 * given, then the server's words.
 */
@Component({
  selector: 'mat-error[ksDateErrorOf]',
  template: `{{ message() }}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DateFieldError {
  readonly control = input.required<AbstractControl>({ alias: 'ksDateErrorOf' });
  readonly required = input('Enter the date');
  private readonly words = inject(DateFieldWords);
  private readonly errors = signal<Record<string, unknown> | null>(null);

  protected readonly message = computed(() => {
    const errors = this.errors();
    if (!errors) return '';
    if (errors['matDatepickerParse']) return `Type the date as ${this.words.pattern()}, with a four-digit year, or pick it from the calendar`;
    if (errors['required']) return this.required();
    if (typeof errors['server'] === 'string') return errors['server'];
    return '';
  });

  constructor() {
    effect((onCleanup) => {
      const control = this.control();
      const update = () => this.errors.set(control.errors);
      update();
      const watching = control.events.subscribe(update);
      onCleanup(() => watching.unsubscribe());
    });
  }
}

/** What a component with a date field imports: the datepicker and the field's message. */
export const DATE_FIELD = [MatDatepickerModule, DateFieldError] as const;

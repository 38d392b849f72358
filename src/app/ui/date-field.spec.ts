import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { DateAdapter } from '@angular/material/core';
import { MatDatepickerInputHarness } from '@angular/material/datepicker/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { CurrentLocale } from '../core/current-locale';
import { DATE_FIELD, DATE_FIELD_FORMATS, DateFieldWords, provideDateField, typedDatePattern } from './date-field';

@Component({
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, DATE_FIELD],
  providers: [provideDateField()],
  template: `
    <mat-form-field>
      <mat-label>Deadline</mat-label>
      <input matInput [matDatepicker]="picker" [formControl]="date" />
      <mat-datepicker-toggle matIconSuffix [for]="picker" />
      <mat-datepicker #picker />
      <mat-hint>{{ dates.pattern() }}</mat-hint>
      <mat-error [ksDateErrorOf]="date" required="Enter the deadline" />
    </mat-form-field>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class DateHost {
  readonly date = new FormControl<string | null>(null, [Validators.required]);
  protected readonly dates = inject(DateFieldWords);
}

/** The zone Chromium runs karma in (the TZ it was started with): these checks hold in every one. */
const ZONE = Intl.DateTimeFormat().resolvedOptions().timeZone;

describe('date field', () => {
  let fixture: ComponentFixture<DateHost>;
  let loader: HarnessLoader;
  let host: DateHost;
  let input: MatDatepickerInputHarness;

  beforeEach(async () => {
    fixture = TestBed.createComponent(DateHost);
    host = fixture.componentInstance;
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    input = await loader.getHarness(MatDatepickerInputHarness);
  });

  const adapter = () => fixture.debugElement.injector.get(DateAdapter) as DateAdapter<string, string>;
  const error = async () => {
    const field = await loader.getHarness(MatFormFieldHarness);
    return (await field.getTextErrors()).join(' ');
  };
  const hint = async () => (await (await loader.getHarness(MatFormFieldHarness)).getTextHints()).join(' ');
  async function useLocale(locale: string): Promise<void> {
    TestBed.inject(CurrentLocale).use(locale);
    await fixture.whenStable();
  }

  it('reads a date typed day first in en-GB, with or without leading zeros, as YYYY-MM-DD', async () => {
    expect(await hint()).toBe('DD/MM/YYYY');
    await input.setValue('03/12/2026');
    expect(host.date.value).toBe('2026-12-03');
    await input.setValue('3/1/2027');
    expect(host.date.value).toBe('2027-01-03');
    await input.blur();
    expect(await input.getValue()).toBe('03/01/2027');
    expect(host.date.valid).toBeTrue();
  });

  it('also takes a date typed as YYYY-MM-DD, and shows one from the API in the locale order', async () => {
    await input.setValue('2026-12-03');
    expect(host.date.value).toBe('2026-12-03');
    host.date.setValue('2027-03-01');
    await fixture.whenStable();
    expect(await input.getValue()).toBe('01/03/2027');
  });

  it('says how to type the date when the text is not one, keeping the text as typed', async () => {
    for (const typed of ['31/02/2026', '3/12/26', '12/2026', 'soon', '03/12/20266', '2026-02-30', '01/01/1899']) {
      await input.setValue(typed);
      await input.blur();
      expect(host.date.value).withContext(typed).toBeNull();
      expect(host.date.hasError('matDatepickerParse')).withContext(typed).toBeTrue();
      expect(await error()).withContext(typed).toBe('Type the date as DD/MM/YYYY, with a four-digit year, or pick it from the calendar');
      expect(await input.getValue()).withContext(typed).toBe(typed);
    }
    await input.setValue('');
    await input.blur();
    expect(await error()).toBe('Enter the deadline');
  });

  it('gives the picked day as YYYY-MM-DD', async () => {
    host.date.setValue('2026-12-03');
    await fixture.whenStable();
    await input.openCalendar();
    const calendar = await input.getCalendar();
    expect(await calendar.getCurrentViewLabel()).toBe('DEC 2026');
    await calendar.next();
    await calendar.selectCell({ text: '31' });
    await fixture.whenStable();
    expect(host.date.value).toBe('2027-01-31');
    expect(await input.getValue()).toBe('31/01/2027');
  });

  it('follows the studio locale: month first in en-US, year first in en-CA and ja-JP', async () => {
    host.date.setValue('2026-12-03');
    await useLocale('en-US');
    expect(await input.getValue()).toBe('12/03/2026');
    expect(await hint()).toBe('MM/DD/YYYY');
    await input.setValue('12/04/2026');
    expect(host.date.value).toBe('2026-12-04');
    await input.setValue('31/12/2026');
    expect(host.date.hasError('matDatepickerParse')).toBeTrue();

    await useLocale('en-CA');
    await input.setValue('2026-12-05');
    await input.blur();
    expect(host.date.value).toBe('2026-12-05');
    expect(await input.getValue()).toBe('2026-12-05');

    await useLocale('ja-JP');
    expect(await input.getValue()).toBe('2026/12/05');
    expect(await hint()).toBe('YYYY/MM/DD');
    await input.setValue('2026/12/06');
    expect(host.date.value).toBe('2026-12-06');
  });

  it('uses the default en-GB order for a locale it does not offer', async () => {
    host.date.setValue('2026-12-03');
    await useLocale('fr-FR');
    expect(await input.getValue()).toBe('03/12/2026');
  });

  // Days where clocks change in Europe (29 Mar, 25 Oct 2026), North America
  // (8 Mar, 1 Nov 2026; in Cuba midnight itself is skipped on 8 Mar), year
  // ends, a leap day and the ends of the server's range.
  const DAYS = ['2026-03-29', '2026-10-25', '2026-03-08', '2026-11-01', '2026-01-01', '2026-12-31', '2028-02-29', '1900-01-01', '2999-12-31'];

  it(`keeps every date-only value on its own calendar day in the browser's zone (${ZONE})`, () => {
    const a = adapter();
    for (const iso of DAYS) {
      const [y, m, d] = iso.split('-').map(Number);
      expect(a.deserialize(iso)).withContext(iso).toBe(iso);
      expect(a.createDate(y, m - 1, d)).withContext(iso).toBe(iso);
      expect([a.getYear(iso), a.getMonth(iso) + 1, a.getDate(iso)]).withContext(iso).toEqual([y, m, d]);
      expect(a.format(iso, 'yyyy-MM-dd')).withContext(iso).toBe(iso);
      expect(a.parse(a.format(iso, DATE_FIELD_FORMATS.display.dateInput as string), DATE_FIELD_FORMATS.parse.dateInput)).withContext(iso).toBe(iso);
      expect(a.addCalendarDays(a.addCalendarDays(iso, 1), -1)).withContext(iso).toBe(iso);
      expect(a.toIso8601(iso)).withContext(iso).toBe(iso);
    }
    expect(a.addCalendarDays('2026-03-28', 1)).toBe('2026-03-29');
    expect(a.addCalendarDays('2026-03-29', 1)).toBe('2026-03-30');
    expect(a.addCalendarMonths('2026-01-31', 1)).toBe('2026-02-28');
    expect(a.addCalendarYears('2028-02-29', 1)).toBe('2029-02-28');
  });

  it(`agrees with a calendar worked in UTC on the weekday and the days in each month (${ZONE})`, () => {
    const a = adapter();
    for (const iso of DAYS) {
      const [y, m, d] = iso.split('-').map(Number);
      // Converting: the same day worked out at UTC midnight, where no zone can move it.
      const utc = new Date(Date.UTC(y, m - 1, d));
      expect(a.getDayOfWeek(iso)).withContext(iso).toBe(utc.getUTCDay());
      expect(a.getNumDaysInMonth(iso)).withContext(iso).toBe(new Date(Date.UTC(y, m, 0)).getUTCDate());
    }
    const now = new Date();
    const local = `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
    expect(a.today()).toBe(local);
  });

  it('gives the typed order of each offered locale', () => {
    expect(typedDatePattern('en-GB')).toBe('DD/MM/YYYY');
    expect(typedDatePattern('en-IE')).toBe('DD/MM/YYYY');
    expect(typedDatePattern('en-US')).toBe('MM/DD/YYYY');
    expect(typedDatePattern('en-CA')).toBe('YYYY-MM-DD');
    expect(typedDatePattern('ja-JP')).toBe('YYYY/MM/DD');
  });
});

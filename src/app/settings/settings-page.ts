import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { DEFAULT_STUDIO_LOCALE, SETTINGS_TEXT_LIMITS, STUDIO_LOCALES, STUDIO_LOCALE_LABELS, type StudioLocale, formatPounds, parsePounds } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { CurrentLocale } from '../core/current-locale';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { LoadStatus } from '../ui/load-status';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { CalendarFeedSettings } from './calendar-feed-settings';
import { SettingsApi } from './settings-api';
import { BLOCK_KINDS, BLOCK_KIND_LABELS, BlockKind, StudioSettings, StudioSettingsPatch, VAT_RATE_LABELS } from './studio-settings';

type VatRate = StudioSettings['vatRate'];
type VatMode = StudioSettings['vatMode'];

/** An amount in pounds that is not negative: "28", "28.50", "£1,200". */
export function poundsAmount(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const pence = parsePounds(text);
  if (pence === null) return { pounds: true };
  return pence < 0 ? { min: true } : null;
}

function wholeNumber(control: AbstractControl): ValidationErrors | null {
  const v = control.value as number | null;
  return v === null || Number.isInteger(v) ? null : { whole: true };
}

function minutesControl(): FormControl<number | null> {
  return new FormControl<number | null>(0, [Validators.required, Validators.min(0), Validators.max(10_000)]);
}

/** The studio's details, rates, VAT, deposit and quote terms, and sewing minutes per block kind. */
@Component({
  selector: 'ks-settings-page',
  imports: [
    ReactiveFormsModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatRadioModule,
    MatButtonModule,
    LoadStatus,
    CalendarFeedSettings,
  ],
  templateUrl: './settings-page.html',
  styleUrl: './settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  private readonly api = inject(SettingsApi);
  private readonly notices = inject(Notices);
  private readonly currentLocale = inject(CurrentLocale);

  protected readonly blockKinds = BLOCK_KINDS;
  protected readonly blockKindLabels = BLOCK_KIND_LABELS;
  protected readonly vatRates: readonly VatRate[] = ['20', '5', '0'];
  protected readonly vatRateLabels = VAT_RATE_LABELS;
  protected readonly locales = STUDIO_LOCALES;
  protected readonly localeLabels = STUDIO_LOCALE_LABELS;

  protected readonly state = signal<'loading' | 'ready' | 'failed'>('loading');
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  /** When the calendar feed's address was made, for its own section. */
  protected readonly feedMadeAt = signal<string | null>(null);

  protected readonly form = new FormGroup({
    studioName: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(SETTINGS_TEXT_LIMITS.studioName)] }),
    makerName: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(SETTINGS_TEXT_LIMITS.makerName)] }),
    address: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(SETTINGS_TEXT_LIMITS.address)] }),
    email: new FormControl('', { nonNullable: true, validators: [Validators.email, Validators.maxLength(SETTINGS_TEXT_LIMITS.email)] }),
    locale: new FormControl<StudioLocale>(DEFAULT_STUDIO_LOCALE, { nonNullable: true }),
    hourlyRate: new FormControl('', { nonNullable: true, validators: [Validators.required, poundsAmount] }),
    vatRegistered: new FormControl(false, { nonNullable: true }),
    vatRate: new FormControl<VatRate>('20', { nonNullable: true }),
    vatMode: new FormControl<VatMode>('line', { nonNullable: true }),
    vatNumber: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(SETTINGS_TEXT_LIMITS.vatNumber)] }),
    depositPercent: new FormControl<number | null>(30, [Validators.required, Validators.min(0), Validators.max(100)]),
    validityDays: new FormControl<number | null>(30, [Validators.required, Validators.min(1), Validators.max(365), wholeNumber]),
    paymentTerms: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(SETTINGS_TEXT_LIMITS.paymentTerms)] }),
    remindQuoteExpiry: new FormControl(true, { nonNullable: true }),
    remindBalanceDue: new FormControl(true, { nonNullable: true }),
    remindGarmentsLate: new FormControl(true, { nonNullable: true }),
    garmentsLateDays: new FormControl<number | null>(14, [Validators.required, Validators.min(1), Validators.max(365), wholeNumber]),
    blockMinutes: new FormGroup(
      Object.fromEntries(BLOCK_KINDS.map((kind) => [kind, minutesControl()])) as Record<BlockKind, FormControl<number | null>>,
    ),
  });
  protected readonly vatRegistered = toSignal(this.form.controls.vatRegistered.valueChanges, { initialValue: false });

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
    this.load();
  }

  protected load(): void {
    this.state.set('loading');
    this.api.get().subscribe({
      next: (settings) => {
        this.fill(settings);
        this.feedMadeAt.set(settings.calendarFeedMadeAt);
        this.state.set('ready');
      },
      error: () => this.state.set('failed'),
    });
  }

  protected saveSettings(): void {
    this.formError.set(null);
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.formError.set('Some settings need a change before they can be saved: see the messages under the fields.');
      return;
    }
    const v = this.form.getRawValue();
    const patch: StudioSettingsPatch = {
      studioName: v.studioName.trim(),
      makerName: v.makerName.trim(),
      address: v.address.trim(),
      email: v.email.trim() || null,
      locale: v.locale,
      hourlyRatePence: parsePounds(v.hourlyRate)!,
      vatRegistered: v.vatRegistered,
      vatRate: v.vatRate,
      vatMode: v.vatMode,
      vatNumber: v.vatNumber.trim() || null,
      depositPercent: v.depositPercent!,
      validityDays: v.validityDays!,
      paymentTerms: v.paymentTerms.trim(),
      blockMinutes: Object.fromEntries(BLOCK_KINDS.map((kind) => [kind, v.blockMinutes[kind] ?? 0])),
      remindQuoteExpiry: v.remindQuoteExpiry,
      remindBalanceDue: v.remindBalanceDue,
      remindGarmentsLate: v.remindGarmentsLate,
      garmentsLateDays: v.garmentsLateDays!,
    };
    this.saving.set(true);
    this.api.update(patch).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.fill(saved);
        this.currentLocale.use(saved.locale);
        this.notices.info('Settings saved.');
      },
      error: (error: unknown) => {
        this.saving.set(false);
        const fields = { ...apiErrorOf(error)?.fields };
        if (fields['hourlyRatePence']) fields['hourlyRate'] = fields['hourlyRatePence'];
        delete fields['hourlyRatePence'];
        applyServerFieldErrors(this.form, fields);
        this.formError.set(messageFor(error));
      },
    });
  }

  private fill(s: StudioSettings): void {
    this.form.reset({
      studioName: s.studioName,
      makerName: s.makerName,
      address: s.address,
      email: s.email ?? '',
      locale: s.locale,
      hourlyRate: formatPounds(s.hourlyRatePence).replace('\u00a3', ''),
      vatRegistered: s.vatRegistered,
      vatRate: s.vatRate,
      vatMode: s.vatMode,
      vatNumber: s.vatNumber ?? '',
      depositPercent: Number(s.depositPercent),
      validityDays: s.validityDays,
      paymentTerms: s.paymentTerms,
      remindQuoteExpiry: s.remindQuoteExpiry,
      remindBalanceDue: s.remindBalanceDue,
      remindGarmentsLate: s.remindGarmentsLate,
      garmentsLateDays: s.garmentsLateDays,
      blockMinutes: Object.fromEntries(BLOCK_KINDS.map((kind) => [kind, s.blockMinutes[kind] ?? 0])) as Record<BlockKind, number>,
    });
  }
}

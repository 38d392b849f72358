import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { FIBRE, Fibre, GARMENT_STATUS_LABELS, GARMENT_TEXT_LIMITS, STAGES, STAGE_LABELS } from '@keepstitch/shared';

import { CommissionDetail, GarmentDetail, orNull } from '../commissions/commission';
import { showDate } from '../shared/dates';
import { CommissionsApi } from '../commissions/commissions-api';
import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { ClientQuote } from '../quotes/client-quote';
import { CautionCards } from '../shared/caution-cards';
import { LoadStatus } from '../shared/load-status';
import { Loader } from '../shared/loader';
import { PhotoGallery } from '../shared/photo-gallery';
import { PhotoUpload } from '../shared/photo-upload';
import { applyServerFieldErrors } from '../shared/server-field-errors';

/** A client's view of one commission: where it is, its cautions, their garments and progress photos. */
@Component({
  selector: 'ks-portal-commission',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    CautionCards,
    PhotoGallery,
    PhotoUpload,
    ClientQuote,
    LoadStatus,
  ],
  templateUrl: './portal-commission.html',
  styleUrl: './portal-commission.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PortalCommission {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);

  readonly id = input.required<string>();
  /** `?quote=` in the quote e-mail's link. */
  readonly quote = input<string | undefined>(undefined);
  /** `?payment=done|cancelled` on return from the card payment page. */
  readonly payment = input<string | undefined>(undefined);

  protected readonly stages = STAGES;
  protected readonly stageLabels = STAGE_LABELS;
  protected readonly statusLabels = GARMENT_STATUS_LABELS;
  protected readonly fibreLabels = FIBRE.labels;
  protected readonly fibres = FIBRE.options;
  protected readonly showDate = showDate;

  private readonly loader = new Loader(() => this.api.get(Number(this.id())));
  protected readonly commission = this.loader.value;
  protected readonly state = this.loader.state;
  /** The quote part loads on its own; the page shows once it has, so nothing below it jumps down. */
  protected readonly quoteSettled = signal(false);
  protected readonly currentIndex = computed(() => {
    const stage = this.commission()?.stage;
    return stage ? STAGES.findIndex((s) => s === stage) : -1;
  });

  protected readonly formOpen = signal(false);
  protected readonly saving = signal(false);
  protected readonly formError = signal<string | null>(null);
  protected readonly added = signal<GarmentDetail | null>(null);
  protected readonly photoUrl = computed(() => {
    const garment = this.added();
    return garment ? `/api/garments/${garment.id}/photos` : null;
  });
  protected readonly form = new FormGroup({
    description: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(GARMENT_TEXT_LIMITS.description)] }),
    whose: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.whose)] }),
    story: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.story)] }),
    fibre: new FormControl<Fibre | null>(null),
    colour: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(GARMENT_TEXT_LIMITS.colour)] }),
  });
  /** The server's limits: the fields stop taking text there. */
  protected readonly limits = GARMENT_TEXT_LIMITS;

  constructor() {
    keepUnsavedWork(() => this.formOpen() && !this.added() && this.form.dirty);
  }

  protected load(): void {
    this.loader.reload();
  }

  protected garmentLine(g: CommissionDetail['garments'][number]): string {
    return [g.whose, g.fibre ? FIBRE.labels[g.fibre] : null, g.colour].filter((part) => !!part).join(' · ');
  }

  protected openForm(): void {
    this.form.reset();
    this.added.set(null);
    this.formError.set(null);
    this.formOpen.set(true);
  }

  protected closeForm(): void {
    this.formOpen.set(false);
    this.added.set(null);
    this.load();
  }

  protected saveGarment(): void {
    const c = this.commission();
    this.formError.set(null);
    if (!c || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.saving.set(true);
    this.api
      .addGarment(c.id, {
        description: v.description.trim(),
        whose: orNull(v.whose),
        story: orNull(v.story),
        fibre: v.fibre,
        colour: orNull(v.colour),
      })
      .subscribe({
        next: (garment) => {
          this.saving.set(false);
          this.added.set(garment);
          this.notices.info(`“${garment.description}” added. Thank you!`);
        },
        error: (error: unknown) => {
          this.saving.set(false);
          applyServerFieldErrors(this.form, apiErrorOf(error)?.fields);
          this.formError.set(messageFor(error));
        },
      });
  }
}

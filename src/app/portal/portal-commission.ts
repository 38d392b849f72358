import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { FIBRE, GARMENT_STATUS_LABELS, GARMENT_TEXT_LIMITS, PHOTO_TEXT_LIMITS, STAGES, STAGE_LABELS } from '@keepstitch/shared';

import { CommissionDetail, GarmentDetail } from '../commissions/commission';
import { showDate } from '../ui/dates';
import { CommissionsApi } from '../commissions/commissions-api';
import { GarmentSave, garmentDraft, someGarmentControls } from '../commissions/garment-form';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { ClientQuote } from '../quotes/client-quote';
import { CautionCards } from '../ui/caution-cards';
import { FieldError } from '../ui/field-error';
import { LoadStatus } from '../ui/load-status';
import { Loader } from '../ui/loader';
import { PhotoGallery } from '../ui/photo-gallery';
import { PhotoUpload } from '../ui/photo-upload';

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
    FieldError,
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
  private readonly save = new GarmentSave();
  protected readonly saving = this.save.saving;
  protected readonly formError = this.save.error;
  protected readonly added = signal<GarmentDetail | null>(null);
  protected readonly photoUrl = computed(() => {
    const garment = this.added();
    return garment ? `/api/garments/${garment.id}/photos` : null;
  });
  /** A client tells what it is, whose, its story, its fibre and colour; the studio adds the rest. */
  protected readonly form = new FormGroup(someGarmentControls(['description', 'whose', 'story', 'fibre', 'colour']));
  /** The server's limits: the fields stop taking text there. */
  protected readonly limits = GARMENT_TEXT_LIMITS;

  /** The garment already logged that the client is adding photos and a note to. */
  protected readonly photosFor = signal<number | null>(null);
  /** The note sent with each photo added to that garment (its caption). */
  protected readonly note = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(PHOTO_TEXT_LIMITS.caption)] });
  private readonly noteText = toSignal(this.note.valueChanges, { initialValue: '' });
  protected readonly caption = computed(() => this.noteText().trim() || null);
  protected readonly captionLimit = PHOTO_TEXT_LIMITS.caption;
  /** Photos sent to that garment since the panel opened. */
  protected readonly photosSent = signal(0);

  constructor() {
    keepUnsavedWork(() => (this.formOpen() && !this.added() && this.form.dirty) || (this.photosFor() !== null && this.note.dirty && this.photosSent() === 0));
  }

  protected openPhotos(garmentId: number): void {
    this.note.reset('');
    this.photosSent.set(0);
    this.photosFor.set(garmentId);
  }

  /** Closes the panel; the garment's new photos show once the page has read them again. */
  protected closePhotos(): void {
    const sent = this.photosSent();
    this.photosFor.set(null);
    if (sent > 0) this.load();
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
    this.save.send(this.api.addGarment(c.id, garmentDraft(this.form.getRawValue())), [this.form], (garment) => {
      this.added.set(garment);
      this.notices.info(`“${garment.description}” added. Thank you!`);
    });
  }
}

import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { AbstractControl, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  AGE_GROUP,
  ALL_STAGES,
  COMMISSION_KIND,
  COMMISSION_TEXT_LIMITS,
  FIBRE,
  GARMENT_STATUS_LABELS,
  STAGE_LABELS,
  Stage,
  formatPounds,
  moveNeedsNote,
} from '@keepstitch/shared';

import { messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { QuoteSection } from '../quotes/quote-section';
import { CautionCards } from '../ui/caution-cards';
import { showMillimetres } from '../ui/length-text';
import { LoadStatus } from '../ui/load-status';
import { DATE_FIELD, DateFieldWords, provideDateField } from '../ui/date-field';
import { Loader } from '../ui/loader';
import { Photo } from '../ui/photo';
import { PhotoGallery } from '../ui/photo-gallery';
import { PhotoUpload } from '../ui/photo-upload';
import { CommissionDetail, StageChoice, daysLeftText } from './commission';
import { showDate, todayIso } from '../ui/dates';
import { CommissionsApi } from './commissions-api';
import { DeliveryChecklist } from './delivery-checklist';
import { GarmentIntake } from './garment-intake';

/** One commission: summary and cautions, garments, stage and its history, hours, progress photos. */
@Component({
  selector: 'ks-commission-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatTableModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    CautionCards,
    PhotoGallery,
    PhotoUpload,
    GarmentIntake,
    QuoteSection,
    LoadStatus,
    DeliveryChecklist,
    DATE_FIELD,
  ],
  providers: [provideDateField()],
  templateUrl: './commission-page.html',
  styleUrl: './commission-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommissionPage {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);
  private readonly auth = inject(Auth);
  protected readonly dates = inject(DateFieldWords);

  /** From the route, `/commissions/:id`. */
  readonly id = input.required<string>();

  protected readonly stageLabels = STAGE_LABELS;
  protected readonly kindLabels = COMMISSION_KIND.labels;
  protected readonly ageLabels = AGE_GROUP.labels;
  protected readonly fibreLabels: Readonly<Record<string, string>> = FIBRE.labels;
  protected readonly statusLabels: Readonly<Record<string, string>> = GARMENT_STATUS_LABELS;
  protected readonly allStages = ALL_STAGES;
  protected readonly showDate = showDate;
  protected readonly daysLeftText = daysLeftText;
  protected readonly showMillimetres = showMillimetres;
  protected readonly garmentColumns = ['description', 'whose', 'fibre', 'status', 'place'];

  private readonly loader = new Loader(() => this.api.get(this.commissionId()), {
    tellMissing: true,
    loaded: (commission) => {
      if (!this.hoursForm.dirty) this.hoursForm.controls.stage.setValue(commission.stage);
    },
  });
  protected readonly state = this.loader.state;
  protected readonly commission = this.loader.value;
  protected readonly intakeOpen = signal(false);
  protected readonly isStaff = computed(() => this.auth.role() === 'owner' || this.auth.role() === 'workroom');
  /** Prices and payments are the owner's alone. */
  protected readonly isOwner = computed(() => this.auth.role() === 'owner');
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly progressUrl = computed(() => `/api/commissions/${this.commissionId()}/photos`);

  protected readonly stageForm = new FormGroup({
    to: new FormControl<Stage | null>(null, [Validators.required]),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.moveNote)] }),
  });
  protected readonly limits = COMMISSION_TEXT_LIMITS;
  protected readonly movingStage = signal(false);
  protected readonly stageError = signal<string | null>(null);

  protected readonly hoursForm = new FormGroup({
    stage: new FormControl<Stage>('enquiry', { nonNullable: true }),
    hours: new FormControl<number | null>(null, [Validators.required, Validators.min(0.25), Validators.max(24), quarterHours]),
    workedOn: new FormControl<string | null>(todayIso(), [Validators.required]),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMISSION_TEXT_LIMITS.hoursNote)] }),
  });
  protected readonly loggingHours = signal(false);
  protected readonly hoursError = signal<string | null>(null);

  /** Every other stage, those not allowed yet disabled with the reason; from the moves allowed when the server gives only those. */
  protected readonly stageChoices = computed<StageChoice[]>(() => {
    const c = this.commission();
    return c?.stageOptions ?? (c?.nextStages ?? []).map((stage) => ({ stage, allowed: true }));
  });
  protected readonly canMove = computed(() => this.stageChoices().some((o) => o.allowed));

  protected readonly garmentPhotos = computed(() => (this.commission()?.garments ?? []).flatMap((g) => g.photos ?? []));
  protected readonly hoursByStage = computed(() => {
    const byStage = this.commission()?.hours?.byStage ?? {};
    return ALL_STAGES.filter((s) => byStage[s] !== undefined).map((s) => ({ stage: s, hours: byStage[s] }));
  });

  /** Each logged entry, the latest work first. */
  /** A stage's name; a stage this page does not know is shown as it is. */
  protected stageName(stage: string): string {
    return (STAGE_LABELS as Record<string, string>)[stage] ?? stage;
  }
  protected pounds(pence: number): string {
    return formatPounds(pence);
  }
  /** Hours over the quote with a plus sign, so more time than quoted reads at a glance. */
  protected signed(hours: string): string {
    return hours.startsWith('-') || hours === '0.00' ? hours : `+${hours}`;
  }
  protected readonly hoursEntries = computed(() =>
    [...(this.commission()?.hours?.entries ?? [])].sort((a, b) =>
      a.workedOn === b.workedOn ? b.id - a.id : a.workedOn < b.workedOn ? 1 : -1,
    ),
  );

  constructor() {
    keepUnsavedWork(() => this.stageForm.dirty || this.hoursForm.dirty);
  }

  protected load(): void {
    this.loader.reload();
  }

  protected noteNeeded(): boolean {
    const c = this.commission();
    const to = this.stageForm.controls.to.value;
    return !!c && !!to && moveNeedsNote(c.stage, to);
  }

  protected moveStage(): void {
    const c = this.commission();
    const { to, note } = this.stageForm.getRawValue();
    this.stageError.set(null);
    if (!c || !to) {
      this.stageForm.controls.to.markAsTouched();
      return;
    }
    if (this.noteNeeded() && note.trim() === '') {
      this.stageForm.controls.note.setErrors({ required: true });
      this.stageForm.controls.note.markAsTouched();
      return;
    }
    this.movingStage.set(true);
    this.api.moveStage(c.id, to, note.trim() || undefined).subscribe({
      next: (reply) => {
        this.movingStage.set(false);
        this.stageForm.reset({ to: null, note: '' });
        this.notices.info(`Moved to ${STAGE_LABELS[reply.stage]}.`);
        this.load();
      },
      error: (error: unknown) => {
        this.movingStage.set(false);
        this.stageError.set(messageFor(error));
      },
    });
  }

  protected logHours(): void {
    const c = this.commission();
    this.hoursError.set(null);
    if (!c || this.hoursForm.invalid) {
      this.hoursForm.markAllAsTouched();
      return;
    }
    const v = this.hoursForm.getRawValue();
    this.loggingHours.set(true);
    this.api
      .logHours(c.id, { stage: v.stage, hours: v.hours!, workedOn: v.workedOn!, ...(v.note.trim() ? { note: v.note.trim() } : {}) })
      .subscribe({
        next: () => {
          this.loggingHours.set(false);
          this.hoursForm.reset({ stage: v.stage, hours: null, workedOn: v.workedOn, note: '' });
          this.notices.info(`${v.hours} h logged against ${STAGE_LABELS[v.stage]}.`);
          this.load();
        },
        error: (error: unknown) => {
          this.loggingHours.set(false);
          this.hoursError.set(messageFor(error));
        },
      });
  }

  protected garmentAdded(): void {
    this.load();
  }

  protected progressUploaded(photos: Photo[]): void {
    this.commission.update((c) => (c ? { ...c, progressPhotos: [...c.progressPhotos, ...photos] } : c));
  }
}

function quarterHours(control: AbstractControl): ValidationErrors | null {
  const v = control.value as number | null;
  return v === null || Number.isInteger(v * 4) ? null : { quarter: true };
}

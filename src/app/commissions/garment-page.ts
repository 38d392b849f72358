import { DatePipe, NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import {
  COLOUR_RUN,
  CONSTRUCTION,
  CUSTODY_LABELS,
  CUSTODY_TEXT_LIMITS,
  FEATURE,
  FIBRE,
  GARMENT_STATUS_LABELS,
  PREWASH,
  PRINT,
  ReturnMethod,
  deriveCustody,
  likelyNextEvent,
} from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Auth } from '../core/auth';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { LoadStatus } from '../ui/load-status';
import { Loader } from '../ui/loader';
import { Photo } from '../ui/photo';
import { PhotoGallery } from '../ui/photo-gallery';
import { PhotoUpload } from '../ui/photo-upload';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { CustodyEventDraft, CustodyEventRow, GarmentDetail } from './commission';
import { CommissionsApi } from './commissions-api';
import { GarmentDetailsForm } from './garment-details-form';
import { PanelsEditor } from './panels-editor';

type RecordableKind = 'received' | 'washed' | 'stored' | 'moved' | 'cut' | 'used' | 'returned' | 'leftovers_returned' | 'withdrawn' | 'correction';
const RECORDABLE: readonly RecordableKind[] = ['received', 'washed', 'stored', 'moved', 'cut', 'used', 'returned', 'leftovers_returned', 'withdrawn', 'correction'];

/** One garment: what it is, its custody log with a form to add to it, its panels and photos. */
@Component({
  selector: 'ks-garment-page',
  imports: [
    DatePipe,
    NgTemplateOutlet,
    ReactiveFormsModule,
    RouterLink,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatButtonModule,
    MatIconModule,
    PanelsEditor,
    GarmentDetailsForm,
    PhotoGallery,
    PhotoUpload,
    LoadStatus,
  ],
  templateUrl: './garment-page.html',
  styleUrl: './garment-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GarmentPage {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);
  private readonly auth = inject(Auth);

  /** From the route, `/commissions/:id/garments/:garmentId`. */
  readonly id = input.required<string>();
  readonly garmentId = input.required<string>();

  protected readonly custodyLabels = CUSTODY_LABELS;
  protected readonly statusLabels = GARMENT_STATUS_LABELS;
  protected readonly fibreLabels = FIBRE.labels;
  protected readonly constructionLabels = CONSTRUCTION.labels;
  protected readonly printLabels = PRINT.labels;
  protected readonly prewashLabels = PREWASH.labels;
  protected readonly colourRunLabels = COLOUR_RUN.labels;
  protected readonly featureLabels = FEATURE.labels;
  protected readonly kinds = RECORDABLE.map((k) => ({ value: k, label: CUSTODY_LABELS[k] }));

  protected readonly isStaff = computed(() => this.auth.role() === 'owner' || this.auth.role() === 'workroom');
  private readonly loader = new Loader(() => this.api.garment(Number(this.garmentId())), {
    // The form offers the usual next entry first (Stored once received...), unless one is being typed.
    loaded: (garment) => {
      if (this.eventForm.pristine) this.eventForm.controls.kind.setValue(likelyNextEvent(deriveCustody(garment.events ?? [])));
    },
  });
  protected readonly garment = this.loader.value;
  protected readonly state = this.loader.state;
  protected readonly editingDetails = signal(false);
  protected readonly photoUrl = computed(() => `/api/garments/${this.garmentId()}/photos`);

  protected readonly eventForm = new FormGroup({
    kind: new FormControl<RecordableKind>('received', { nonNullable: true }),
    place: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(CUSTODY_TEXT_LIMITS.place)] }),
    returnMethod: new FormControl<ReturnMethod>('in_person', { nonNullable: true }),
    trackingRef: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(CUSTODY_TEXT_LIMITS.trackingRef)] }),
    correctsEventId: new FormControl<number | null>(null),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(CUSTODY_TEXT_LIMITS.note)] }),
  });
  protected readonly limits = CUSTODY_TEXT_LIMITS;
  protected readonly kind = toSignal(this.eventForm.controls.kind.valueChanges, { initialValue: this.eventForm.controls.kind.value });
  protected readonly returnMethod = toSignal(this.eventForm.controls.returnMethod.valueChanges, {
    initialValue: this.eventForm.controls.returnMethod.value,
  });
  protected readonly recording = signal(false);
  protected readonly eventError = signal<string | null>(null);

  protected readonly events = computed(() => [...(this.garment()?.events ?? [])].sort((a, b) => (a.at < b.at ? 1 : a.at > b.at ? -1 : b.id - a.id)));
  protected readonly correctable = computed(() => {
    const all = this.garment()?.events ?? [];
    const voided = new Set(all.filter((e) => e.kind === 'correction').map((e) => e.correctsEventId));
    return all.filter((e) => e.kind !== 'correction' && e.kind !== 'announced' && !voided.has(e.id));
  });
  protected readonly voided = computed(
    () => new Set((this.garment()?.events ?? []).filter((e) => e.kind === 'correction').map((e) => e.correctsEventId)),
  );

  constructor() {
    keepUnsavedWork(() => this.eventForm.dirty);
  }

  protected load(): void {
    this.loader.reload();
  }

  protected describe(event: CustodyEventRow): string {
    const parts: string[] = [CUSTODY_LABELS[event.kind] ?? event.kind];
    if (event.place) parts.push(`at ${event.place}`);
    if (event.returnMethod === 'in_person') parts.push('in person');
    if (event.returnMethod === 'post') parts.push(`by post${event.trackingRef ? `, tracking ${event.trackingRef}` : ''}`);
    if (event.kind === 'correction' && event.correctsEventId) {
      const target = this.garment()?.events?.find((e) => e.id === event.correctsEventId);
      if (target) parts.push(`of “${CUSTODY_LABELS[target.kind]}” entry`);
    }
    return parts.join(' ');
  }

  protected recordEvent(): void {
    const v = this.eventForm.getRawValue();
    const c = this.eventForm.controls;
    this.eventError.set(null);
    // Text over its limit, in a field this kind of entry shows, is marked on its field and not sent.
    const shown = [c.note];
    if (v.kind === 'received' || v.kind === 'stored' || v.kind === 'moved') shown.push(c.place);
    if ((v.kind === 'returned' || v.kind === 'leftovers_returned') && v.returnMethod === 'post') shown.push(c.trackingRef);
    const tooLong = shown.filter((control) => control.hasError('maxlength'));
    if (tooLong.length) {
      for (const control of tooLong) control.markAsTouched();
      return;
    }
    const note = v.note.trim() || undefined;
    const place = v.place.trim();
    let draft: CustodyEventDraft;
    switch (v.kind) {
      case 'stored':
      case 'moved':
        if (!place) return this.missing(c.place);
        draft = { kind: v.kind, place, note };
        break;
      case 'received':
        draft = { kind: 'received', ...(place ? { place } : {}), note };
        break;
      case 'returned':
      case 'leftovers_returned':
        if (v.returnMethod === 'post' && !v.trackingRef.trim()) return this.missing(c.trackingRef);
        draft = {
          kind: v.kind,
          returnMethod: v.returnMethod,
          ...(v.returnMethod === 'post' ? { trackingRef: v.trackingRef.trim() } : {}),
          note,
        };
        break;
      case 'correction':
        if (v.correctsEventId === null) return this.missing(c.correctsEventId);
        if (!note) return this.missing(c.note);
        draft = { kind: 'correction', correctsEventId: v.correctsEventId, note };
        break;
      default:
        draft = { kind: v.kind, note };
    }
    const garment = this.garment();
    if (!garment) return;
    this.recording.set(true);
    this.api.recordEvent(garment.id, draft).subscribe({
      next: (reply) => {
        this.recording.set(false);
        this.eventForm.reset({ kind: likelyNextEvent(reply.state), returnMethod: 'in_person' });
        this.notices.info(`${CUSTODY_LABELS[reply.event.kind]} recorded. Now: ${GARMENT_STATUS_LABELS[reply.state.status]}${reply.state.place ? `, at ${reply.state.place}` : ''}.`);
        this.load();
      },
      error: (error: unknown) => {
        this.recording.set(false);
        applyServerFieldErrors(this.eventForm, apiErrorOf(error)?.fields);
        this.eventError.set(messageFor(error));
      },
    });
  }

  private missing(control: FormControl<unknown>): void {
    control.setErrors({ required: true });
    control.markAsTouched();
  }

  /**
   * The reply carries the garment's own fields; status, place, log and what to
   * take off for safety come with the next load, which follows at once.
   */
  protected detailsSaved(changed: GarmentDetail): void {
    this.garment.update((g) => (g ? { ...g, ...changed } : changed));
    this.editingDetails.set(false);
    this.notices.info(`Details of “${changed.description}” saved.`);
    this.load();
  }

  protected photosUploaded(photos: Photo[]): void {
    this.garment.update((g) => (g ? { ...g, photos: [...(g.photos ?? []), ...photos] } : g));
  }
}

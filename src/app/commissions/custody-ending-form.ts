import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { CUSTODY_LABELS, CUSTODY_TEXT_LIMITS, GARMENT_STATUS_LABELS, ReturnMethod } from '@keepstitch/shared';

import { apiErrorOf, messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { keepUnsavedWork } from '../core/unsaved-work';
import { FieldError } from '../ui/field-error';
import { applyServerFieldErrors } from '../ui/server-field-errors';
import { CustodyEventDraft, Garment } from './commission';
import { CommissionsApi } from './commissions-api';

type Ending = 'used' | 'returned' | 'leftovers_returned' | 'withdrawn';
/** A garment in the studio ends in the piece or going back; one that never came is withdrawn. */
const IN_STUDIO: readonly Ending[] = ['used', 'returned', 'leftovers_returned'];
const NEVER_CAME: readonly Ending[] = ['withdrawn'];

/**
 * How one garment's custody ends at delivery: used in the piece, returned
 * whole, or its leftovers returned, with how and a note; or, if it never
 * came, withdrawn.
 */
@Component({
  selector: 'ks-custody-ending-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatButtonModule, FieldError],
  templateUrl: './custody-ending-form.html',
  styleUrl: './custody-ending-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CustodyEndingForm implements OnInit {
  private readonly api = inject(CommissionsApi);
  private readonly notices = inject(Notices);

  readonly garment = input.required<Garment>();
  /** After the entry is recorded; the page reloads. */
  readonly recorded = output<void>();

  protected readonly endings = computed(() => (this.garment().status === 'expected' ? NEVER_CAME : IN_STUDIO).map((value) => ({ value, label: CUSTODY_LABELS[value] })));
  protected readonly limits = CUSTODY_TEXT_LIMITS;
  protected readonly form = new FormGroup({
    ending: new FormControl<Ending>('used', { nonNullable: true }),
    returnMethod: new FormControl<ReturnMethod>('in_person', { nonNullable: true }),
    trackingRef: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(CUSTODY_TEXT_LIMITS.trackingRef)] }),
    note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(CUSTODY_TEXT_LIMITS.note)] }),
  });
  protected readonly ending = toSignal(this.form.controls.ending.valueChanges, { initialValue: this.form.controls.ending.value });
  protected readonly returnMethod = toSignal(this.form.controls.returnMethod.valueChanges, { initialValue: this.form.controls.returnMethod.value });
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);

  constructor() {
    keepUnsavedWork(() => this.form.dirty);
  }

  ngOnInit(): void {
    this.form.controls.ending.setValue(this.likelyEnding());
  }

  /** Withdrawn for a garment that never came; leftovers returned when the client wants something back; else used in the piece. */
  private likelyEnding(): Ending {
    const g = this.garment();
    return g.status === 'expected' ? 'withdrawn' : g.returnsToClient ? 'leftovers_returned' : 'used';
  }

  protected record(): void {
    const v = this.form.getRawValue();
    const c = this.form.controls;
    this.error.set(null);
    const sendsBack = v.ending !== 'used' && v.ending !== 'withdrawn';
    const byPost = sendsBack && v.returnMethod === 'post';
    const shown = byPost ? [c.note, c.trackingRef] : [c.note];
    if (shown.some((control) => control.hasError('maxlength'))) {
      shown.forEach((control) => control.markAsTouched());
      return;
    }
    if (byPost && !v.trackingRef.trim()) {
      c.trackingRef.setErrors({ required: true });
      c.trackingRef.markAsTouched();
      return;
    }
    const note = v.note.trim() || undefined;
    const draft: CustodyEventDraft =
      v.ending === 'used' || v.ending === 'withdrawn'
        ? { kind: v.ending, note }
        : { kind: v.ending, returnMethod: v.returnMethod, ...(byPost ? { trackingRef: v.trackingRef.trim() } : {}), note };
    this.saving.set(true);
    this.api.recordEvent(this.garment().id, draft).subscribe({
      next: (reply) => {
        this.saving.set(false);
        this.form.reset({ ending: this.likelyEnding() });
        this.notices.info(`“${this.garment().description}”: ${GARMENT_STATUS_LABELS[reply.state.status].toLowerCase()}.`);
        this.recorded.emit();
      },
      error: (error: unknown) => {
        this.saving.set(false);
        applyServerFieldErrors(this.form, apiErrorOf(error)?.fields);
        this.error.set(messageFor(error));
      },
    });
  }
}

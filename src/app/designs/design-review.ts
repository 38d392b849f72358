import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { DESIGN_TEXT_LIMITS, DesignDerivation, Length, formatLength } from '@keepstitch/shared';

import { messageFor } from '../core/api-error';
import { Notices } from '../core/notices';
import { SharedDesign, swatchOf } from './design';
import { DesignsApi } from './designs-api';
import { QuiltDrawing } from './quilt-drawing';

/** The client's view of a shared design: the drawing, its size, and their answer. */
@Component({
  selector: 'ks-design-review',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatIconModule, QuiltDrawing],
  template: `
    <section class="review" aria-labelledby="review-heading">
      <div class="head">
        <a mat-icon-button [routerLink]="['/portal', commissionId()]" aria-label="Back to my commission"><mat-icon>arrow_back</mat-icon></a>
        <h1 id="review-heading">Your design</h1>
      </div>
      @if (missing()) {
        <p role="status">The maker has not shared a design yet.</p>
      }
      @if (shared(); as s) {
        <p>{{ s.commission.title }}, version {{ s.version }}, shared {{ s.sharedAt | date: 'd MMM y' }}.</p>
        <ks-quilt-drawing [body]="s.body" [derived]="derived()!" [colours]="colours()" [kept]="s.keptFeatures ?? []" />
        <p data-testid="review-size">Finished size {{ size() }}.</p>
        <ul class="legend">
          @for (f of s.fabrics; track f.key) { <li data-testid="review-fabric"><span class="swatch" [style.background]="swatch(f)"></span>{{ f.name }}</li> }
        </ul>
        @if (s.clientResponse) {
          <p role="status" data-testid="review-answer">You {{ s.clientResponse === 'approved' ? 'approved this design' : 'asked for a change' }}{{ s.clientNote ? ': “' + s.clientNote + '”' : '.' }}</p>
        }
        <form [formGroup]="form" (ngSubmit)="send('changes_requested')">
          <mat-form-field class="note">
            <mat-label>A note for the maker</mat-label>
            <textarea matInput formControlName="note" rows="3"></textarea>
            @if (form.controls.note.hasError('required')) { <mat-error>Say what you would like changed.</mat-error> }
          </mat-form-field>
          @if (error(); as e) { <p class="problem" role="alert">{{ e }}</p> }
          <div class="buttons">
            <button mat-flat-button type="button" (click)="send('approved')">Approve this design</button>
            <button mat-stroked-button type="submit">Ask for a change</button>
          </div>
        </form>
      }
    </section>
  `,
  styles: `
    .review { padding: 16px; max-width: 900px; }
    .head { display: flex; align-items: center; gap: 8px; }
    ks-quilt-drawing { max-width: 600px; }
    .legend { display: flex; flex-wrap: wrap; gap: 12px; list-style: none; padding: 0; }
    .swatch { display: inline-block; width: 14px; height: 14px; margin-right: 6px; border: 1px solid #0004; vertical-align: middle; }
    .note { width: 100%; }
    .buttons { display: flex; gap: 8px; }
    .problem { color: var(--mat-sys-error); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignReview {
  private readonly api = inject(DesignsApi);
  private readonly notices = inject(Notices);
  readonly id = input.required<string>();
  protected readonly commissionId = computed(() => Number(this.id()));
  protected readonly shared = signal<SharedDesign | null>(null);
  protected readonly missing = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly derived = computed(() => this.shared()?.derived as DesignDerivation | undefined);
  protected readonly colours = computed(() => Object.fromEntries((this.shared()?.fabrics ?? []).map((f) => [f.key, f.hex])) as Record<string, string>);
  protected readonly size = computed(() => {
    const d = this.derived();
    if (!d) return '';
    const both = (mm: string) => `${formatLength(Length.millimetres(mm), 'imperial')} (${formatLength(Length.millimetres(mm), 'metric')})`;
    return `${both(d.finished.widthMm)} × ${both(d.finished.lengthMm)}`;
  });
  protected readonly swatch = swatchOf;
  protected readonly form = new FormGroup({ note: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(DESIGN_TEXT_LIMITS.responseNote)] }) });

  constructor() {
    effect(() => this.load(this.commissionId()));
  }

  private load(id: number): void {
    this.api.shared(id).subscribe({ next: (s) => this.shared.set(s), error: () => this.missing.set(true) });
  }

  protected send(response: 'approved' | 'changes_requested'): void {
    const note = this.form.controls.note.value.trim();
    if (response === 'changes_requested' && !note) {
      this.form.controls.note.setErrors({ required: true });
      this.form.controls.note.markAsTouched();
      return;
    }
    this.error.set(null);
    this.api.respond(this.commissionId(), response, note || null).subscribe({
      next: () => {
        this.notices.info(response === 'approved' ? 'Thank you: the maker will see your approval.' : 'Sent to the maker.');
        this.form.reset({ note: '' });
        this.load(this.commissionId());
      },
      error: (err: unknown) => this.error.set(messageFor(err)),
    });
  }
}

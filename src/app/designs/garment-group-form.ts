import { ChangeDetectionStrategy, Component, effect, input, output, signal, untracked } from '@angular/core';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { GARMENT_GROUP_LIMITS, GarmentGroup } from '@keepstitch/shared';

import { GarmentSource } from './design';

/** A group as the form gives it: its name and garments (the design gives it its id). */
export type GroupDraft = Omit<GarmentGroup, 'id'>;

const inOrder = (ids: readonly number[]) => [...ids].sort((x, y) => x - y).join(',');
const sameGarments = (a: readonly number[], b: readonly number[]) => inOrder(a) === inOrder(b);

/**
 * Makes or changes a named group of the commission's garments: a name and the
 * garments ticked. A group needs two garments at least (one is the garment
 * itself), and no two groups may share a name or the same garments.
 */
@Component({
  selector: 'ks-garment-group-form',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatCheckboxModule, MatButtonModule],
  template: `
    <form [formGroup]="form" class="group-form" (ngSubmit)="saveGroup()" data-testid="group-form" [attr.aria-label]="group() ? 'Change the group ' + group()!.name : 'New group of garments'">
      <mat-form-field>
        <mat-label>Group name</mat-label>
        <input matInput formControlName="name" [maxlength]="nameLimit" />
        @if (form.controls.name.hasError('required')) {
          <mat-error>Give the group a name.</mat-error>
        }
        @if (form.controls.name.hasError('taken')) {
          <mat-error>Another group has that name.</mat-error>
        }
      </mat-form-field>
      <fieldset>
        <legend>Garments in the group</legend>
        @for (g of garments(); track g.id; let i = $index) {
          <mat-checkbox [formControl]="form.controls.picked.at(i)">{{ g.description }}@if (!g.panels.length) { <small> (no panels measured yet)</small> }</mat-checkbox>
        }
      </fieldset>
      @if (problem(); as p) {
        <p class="problem" role="alert">{{ p }}</p>
      }
      <div class="buttons">
        <button mat-flat-button type="submit">{{ group() ? 'Save group' : 'Add group' }}</button>
        <button mat-button type="button" (click)="cancelled.emit()">Cancel</button>
      </div>
    </form>
  `,
  styles: `
    .group-form { display: flex; flex-direction: column; gap: 4px; padding: 8px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 6px; }
    fieldset { border: 0; padding: 0; margin: 0; display: flex; flex-direction: column; }
    legend { font-weight: 500; margin-bottom: 4px; }
    small { color: var(--mat-sys-on-surface-variant); }
    .problem { color: var(--mat-sys-error); margin: 0; }
    .buttons { display: flex; gap: 8px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class GarmentGroupForm {
  readonly garments = input.required<readonly GarmentSource[]>();
  /** The group being changed, or null for a new one. */
  readonly group = input<GarmentGroup | null>(null);
  /** The other groups, which this one may not copy. */
  readonly others = input<readonly GarmentGroup[]>([]);
  readonly saved = output<GroupDraft>();
  readonly cancelled = output<void>();

  protected readonly form = new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [(c) => this.nameProblem(c.value as string)] }),
    picked: new FormArray<FormControl<boolean>>([]),
  });
  protected readonly problem = signal<string | null>(null);
  protected readonly nameLimit = GARMENT_GROUP_LIMITS.name;

  constructor() {
    effect(() => {
      const garments = this.garments();
      const group = this.group();
      untracked(() => {
        const ids = new Set(group?.garmentIds ?? []);
        this.form.controls.picked.clear();
        for (const g of garments) this.form.controls.picked.push(new FormControl(ids.has(g.id), { nonNullable: true }));
        this.form.controls.name.setValue(group?.name ?? '');
        this.problem.set(null);
      });
    });
  }

  private nameProblem(name: string): ValidationErrors | null {
    const n = (name ?? '').trim().toLowerCase();
    if (!n) return { required: true };
    return this.others().some((o) => o.name.trim().toLowerCase() === n) ? { taken: true } : null;
  }

  protected saveGroup(): void {
    this.form.controls.name.updateValueAndValidity();
    this.form.markAllAsTouched();
    const garmentIds = this.garments()
      .filter((_, i) => this.form.controls.picked.at(i).value)
      .map((g) => g.id);
    if (garmentIds.length < 2) {
      this.problem.set('Tick two garments at least; for one garment, use the garment itself.');
      return;
    }
    const group: GroupDraft = { name: this.form.controls.name.value.trim(), garmentIds };
    const same = this.others().find((o) => sameGarments(o.garmentIds, garmentIds));
    if (same) {
      this.problem.set(`The group “${same.name}” has these garments already.`);
      return;
    }
    this.problem.set(null);
    if (this.form.invalid) return;
    this.saved.emit(group);
  }
}

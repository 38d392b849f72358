import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

export interface MoveNoteDialogData {
  title: string;
  stageLabel: string;
}

/** Asks why a commission goes back a stage or is cancelled. Closes with the note, or nothing. */
@Component({
  selector: 'ks-move-note-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <h2 mat-dialog-title>Move “{{ data.title }}” to {{ data.stageLabel }}?</h2>
    <form (ngSubmit)="confirm()">
      <mat-dialog-content>
        <p>Going back a stage or cancelling needs a note saying why.</p>
        <mat-form-field class="note">
          <mat-label>Note</mat-label>
          <textarea matInput [formControl]="note" rows="3" cdkFocusInitial></textarea>
          @if (note.hasError('required')) {
            <mat-error>Say why it moves</mat-error>
          }
        </mat-form-field>
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" [mat-dialog-close]="undefined">Keep it where it is</button>
        <button mat-flat-button type="submit">Move to stage</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `.note { width: 100%; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MoveNoteDialog {
  protected readonly data = inject<MoveNoteDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<MoveNoteDialog, string>>(MatDialogRef);
  protected readonly note = new FormControl('', { nonNullable: true, validators: [Validators.required] });

  protected confirm(): void {
    if (this.note.value.trim() === '') {
      this.note.setValue('');
      this.note.markAsTouched();
      return;
    }
    this.ref.close(this.note.value.trim());
  }
}

import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface DeleteClientDialogData {
  name: string;
}

/** Asks before a client record is deleted. Closes with true to go ahead. */
@Component({
  selector: 'ks-delete-client-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Delete this client?</h2>
    <mat-dialog-content>
      <p>
        <strong>{{ data.name }}</strong> and their details will be removed from Keepstitch.
        This cannot be undone.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>Keep client</button>
      <button mat-flat-button type="button" class="danger" [mat-dialog-close]="true">Delete client</button>
    </mat-dialog-actions>
  `,
  styles: `
    @use '@angular/material' as mat;
    .danger {
      @include mat.button-overrides(
        (
          filled-container-color: var(--mat-sys-error),
          filled-label-text-color: var(--mat-sys-on-error),
        )
      );
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeleteClientDialog {
  protected readonly data = inject<DeleteClientDialogData>(MAT_DIALOG_DATA);
}

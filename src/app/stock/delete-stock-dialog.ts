import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';

export interface DeleteStockDialogData {
  name: string;
}

/** Asks before a studio fabric is taken off the list. Closes with true to go ahead. */
@Component({
  selector: 'ks-delete-stock-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>Remove this fabric?</h2>
    <mat-dialog-content>
      <p><strong>{{ data.name }}</strong> will be taken off the studio fabric list. This cannot be undone.</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false" cdkFocusInitial>Keep it</button>
      <button mat-flat-button type="button" [mat-dialog-close]="true">Remove fabric</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeleteStockDialog {
  protected readonly data = inject<DeleteStockDialogData>(MAT_DIALOG_DATA);
}

import { Dialog } from '@angular/cdk/dialog';
import { Provider } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { MAT_ICON_DEFAULT_OPTIONS } from '@angular/material/icon';

/**
 * Material's settings for every page: outlined form fields, and icons from
 * the bundled symbol font. The shell gives them, not the app root, so that
 * Material stays out of the first load. A dialog is built from the injector
 * of the dialog service that opens it (at the root, that would miss these
 * settings), so the dialog services are given here as well.
 */
export function provideMaterialDefaults(): Provider[] {
  return [
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { appearance: 'outline' } },
    { provide: MAT_ICON_DEFAULT_OPTIONS, useValue: { fontSet: 'material-symbols-outlined' } },
    Dialog,
    MatDialog,
  ];
}

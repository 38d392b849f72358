import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { FieldError } from './field-error';

@Component({
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, FieldError],
  template: `
    <mat-form-field>
      <mat-label>Whose it was</mat-label>
      <input matInput [formControl]="control" />
      <mat-error [ksErrorOf]="control" required="Say whose it was" />
    </mat-form-field>
  `,
})
class Host {
  readonly control = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(5)] });
}

describe('FieldError', () => {
  function shown(fixture: { nativeElement: HTMLElement; detectChanges(): void }): string {
    fixture.detectChanges();
    return fixture.nativeElement.querySelector('mat-error')?.textContent?.trim() ?? '';
  }


  it('says what each error asks for, first error first, and follows the field as it changes', () => {
    const fixture = TestBed.createComponent(Host);
    const control = fixture.componentInstance.control;
    control.markAsTouched();
    expect(shown(fixture)).toBe('Say whose it was');
    control.setValue('Grandad');
    expect(shown(fixture)).toBe('At most 5 characters');
    control.setValue('Dad');
    control.setErrors({ server: 'The server kept none of it.' });
    expect(shown(fixture)).toBe('The server kept none of it.');
    control.setValue('Mum');
    expect(shown(fixture)).toBe('');
  });
});

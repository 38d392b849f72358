import { ChangeDetectionStrategy, Component, effect, input, signal } from '@angular/core';
import type { AbstractControl } from '@angular/forms';

/**
 * The one message a field shows under it, on Material's own `<mat-error>`:
 * `<mat-error [ksErrorOf]="form.controls.whose" required="Describe the garment" />`.
 * It says what the first error asks for: the `required` text given, the
 * page's own words for an error by its key (`messages`), "Use at least N" or
 * "At most N characters" for a length rule (N from the validator), or the
 * server's own words for that field (`server`, from `applyServerFieldErrors`).
 */
@Component({
  selector: 'mat-error[ksErrorOf]',
  template: `{{ message() }}`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldError {
  readonly control = input.required<AbstractControl>({ alias: 'ksErrorOf' });
  /** What to say when the field is required and empty. */
  readonly required = input('This is needed');
  /** The page's own words for an error by its key ("email", "mismatch", or a built-in one such as "maxlength"). */
  readonly messages = input<Readonly<Record<string, string>>>({});

  protected readonly message = signal('');

  constructor() {
    effect((onCleanup) => {
      const control = this.control();
      const update = () => this.message.set(this.messageFor(control));
      update();
      const watching = control.events.subscribe(update);
      onCleanup(() => watching.unsubscribe());
    });
  }

  private messageFor(control: AbstractControl): string {
    const errors = control.errors;
    if (!errors) return '';
    if (errors['required']) return this.required();
    for (const [key, text] of Object.entries(this.messages())) if (errors[key]) return text;
    if (errors['minlength']) return `Use at least ${(errors['minlength'] as { requiredLength: number }).requiredLength} characters`;
    if (errors['maxlength']) return `At most ${(errors['maxlength'] as { requiredLength: number }).requiredLength} characters`;
    if (typeof errors['server'] === 'string') return errors['server'];
    return '';
  }
}
